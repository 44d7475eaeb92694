import { z } from "zod";
import { FEED_SCOPES } from "@/db/types";

export const feedScopeSchema = z.enum(FEED_SCOPES, "Choose what the feed follows.");

export const createFeedSchema = z.object({
  scope: feedScopeSchema,
  scopeId: z.uuid("Choose a telescope, a program or an observer."),
});
export type CreateFeedInput = z.infer<typeof createFeedSchema>;

export const revokeFeedSchema = z.object({ feedId: z.uuid("Unknown feed.") });
