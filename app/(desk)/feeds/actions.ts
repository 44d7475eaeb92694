"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { createFeedSchema, revokeFeedSchema } from "@/lib/calendar-feeds/schemas";
import { createFeed, feedPath, FeedNotAllowedError, FeedNotFoundError, FeedTargetNotFoundError, revokeFeed } from "@/lib/calendar-feeds/service";

/** Answers the feed's path with its secret token: the only time it is ever shown. */
export async function createFeedAction(input: unknown): Promise<ActionResult<{ path: string; label: string }>> {
  return runAction(async () => {
    const user = await requireActionRole();
    const values = createFeedSchema.parse(input);
    const feed = await createFeed(getDb(), user, values);
    revalidatePath("/feeds");
    return { ok: true, message: `Feed created: ${feed.label}.`, data: { path: feedPath(feed.token), label: feed.label } };
  }, [FeedNotAllowedError, FeedTargetNotFoundError]);
}

export async function revokeFeedAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole();
    const { feedId } = revokeFeedSchema.parse(input);
    await revokeFeed(getDb(), user, feedId);
    revalidatePath("/feeds");
    return { ok: true, message: "Feed revoked: calendar apps using it get nothing more." };
  }, [FeedNotFoundError]);
}
