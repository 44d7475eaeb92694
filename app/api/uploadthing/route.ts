import { createRouteHandler } from "uploadthing/server";
import { attachmentRouter } from "@/lib/attachments/app-router";

// UploadThing's route: presigned URLs for the browser, and the upload service's callback.
// Configured from UPLOADTHING_TOKEN (and UPLOADTHING_INGEST_URL / UPLOADTHING_API_URL for
// the local fake), read when the first request arrives.
let handler: ((request: Request) => Promise<Response>) | undefined;

function handle(request: Request): Promise<Response> {
  if (!process.env.UPLOADTHING_TOKEN) {
    return Promise.resolve(
      Response.json({ message: "Uploads are not configured on this server (UPLOADTHING_TOKEN is missing)." }, { status: 503 }),
    );
  }
  handler ??= createRouteHandler({ router: attachmentRouter, config: { logLevel: "Error" } });
  return handler(request);
}

export const GET = (request: Request) => handle(request);
export const POST = (request: Request) => handle(request);
