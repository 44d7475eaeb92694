export default function Loading() {
  return <p className="text-muted" aria-live="polite">Computing feasibility and slots for this request…</p>;
}
