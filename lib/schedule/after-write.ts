/**
 * After any write to the blocks (an edit, an import, an approval's splice): the schedule
 * answers and tonight's night snapshots this process keeps are forgotten, so the next read
 * in this process sees the write. Call it after the transaction, committed or not.
 */
import { forgetNightSnapshots } from "@/lib/tonight/night-snapshots";
import { forgetScheduleFingerprint } from "./schedule-cache";

export function scheduleChanged(): void {
  forgetScheduleFingerprint();
  forgetNightSnapshots();
}
