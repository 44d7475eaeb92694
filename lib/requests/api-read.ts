import { z } from "zod";
import type { Db } from "@/db/index";
import { listAttachments } from "@/lib/attachments/queries";
import { toApiRequest, type ApiRequest } from "./api-shape";
import { RequestNotFoundError } from "./errors";
import { listRequestEvents } from "./queries";
import { findRequestForViewer, type Actor } from "./service";

/** A request id from a URL; anything malformed is simply not found. */
export function parseRequestId(id: unknown): string {
  const parsed = z.uuid().safeParse(id);
  if (!parsed.success) throw new RequestNotFoundError();
  return parsed.data;
}

/** The request as the API shows it, if the viewer may see it (their own; any filed one for a director). */
export async function readApiRequest(db: Db, viewer: Actor, id: string): Promise<ApiRequest> {
  const request = await findRequestForViewer(db, viewer, id);
  if (!request) throw new RequestNotFoundError();
  const [history, attachments] = await Promise.all([listRequestEvents(db, id), listAttachments(db, id)]);
  return toApiRequest(request, history, attachments);
}
