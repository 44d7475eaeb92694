import type { BlockKind } from "@/db/types";
import { cn } from "@/lib/cn";

const LABEL: Record<BlockKind, string> = {
  science: "Science",
  engineering: "Engineering",
  discretionary: "Discretionary",
  too: "Override",
  payback: "Payback",
};

const STYLE: Record<BlockKind, string> = {
  science: "bg-kind-science text-white",
  engineering: "bg-kind-engineering text-white",
  discretionary: "bg-kind-discretionary text-black",
  too: "bg-kind-too text-black",
  payback: "bg-kind-payback text-white",
};

export function KindBadge({ kind }: { kind: BlockKind }) {
  return <span className={cn("rounded px-1.5 py-0.5 text-2xs font-semibold uppercase tracking-wide", STYLE[kind])}>{LABEL[kind]}</span>;
}
