import { getDb } from "@/db/index";
import { renderFeed } from "@/lib/calendar-feeds/service";

// Public by design: the secret token in the path is the credential a calendar app carries.
export async function GET(_request: Request, { params }: { params: Promise<{ token: string }> }): Promise<Response> {
  const { token } = await params;
  const body = await renderFeed(getDb(), token.replace(/\.ics$/i, ""));
  if (body === null) return new Response("No such calendar feed.\n", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  return new Response(body, {
    headers: {
      "Content-Type": "text/calendar; charset=utf-8",
      "Content-Disposition": 'inline; filename="nightbreak.ics"',
      "Cache-Control": "private, max-age=300",
    },
  });
}
