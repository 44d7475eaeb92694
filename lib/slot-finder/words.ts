import type { BlockKind } from "@/db/types";

export const KIND_WORDS: Record<BlockKind, string> = {
  science: "science",
  engineering: "engineering time",
  discretionary: "discretionary time",
  too: "override",
  payback: "payback",
};
