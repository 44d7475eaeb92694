import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getDb } from "@/db/index";
import { TonightView } from "@/components/tonight/tonight-view";
import { Alert } from "@/components/ui/alert";
import { requirePageRole } from "@/lib/auth/session";
import { QUEUE_VIEW_ROLES } from "@/lib/tonight/access";
import { TonightFieldError, TonightNotFoundError } from "@/lib/tonight/errors";
import { getTonightQueue } from "@/lib/tonight/queue";
import { nightOfSchema, telescopeRefSchema } from "@/lib/tonight/schemas";
import { acknowledgeChangesAction, logExecutionAction } from "./actions";

type Props = { params: Promise<{ telescope: string }>; searchParams: Promise<{ night?: string | string[] }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { telescope } = await params;
  return { title: `Tonight on ${telescope.toUpperCase()}` };
}

export default async function TonightTelescopePage({ params, searchParams }: Props) {
  const user = await requirePageRole(...QUEUE_VIEW_ROLES);
  const ref = telescopeRefSchema.safeParse((await params).telescope);
  if (!ref.success) notFound();
  const asked = (await searchParams).night;
  const night = nightOfSchema.safeParse(Array.isArray(asked) ? asked[0] : asked);
  const badNight = asked !== undefined && !night.success;

  let queue;
  try {
    queue = await getTonightQueue(getDb(), user, ref.data, night.success ? night.data : undefined);
  } catch (error) {
    if (error instanceof TonightNotFoundError) notFound();
    if (error instanceof TonightFieldError) return <Alert tone="error">{error.message}</Alert>;
    throw error;
  }
  return (
    <>
      {badNight && (
        <div className="mb-4">
          <Alert tone="error">That night is not a date (YYYY-MM-DD): showing tonight instead.</Alert>
        </div>
      )}
      <TonightView initial={queue} night={night.success ? night.data : null} acknowledge={acknowledgeChangesAction} logExecution={logExecutionAction} />
    </>
  );
}
