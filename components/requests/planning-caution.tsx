/** Said wherever feasibility figures are shown. */
export function PlanningCaution() {
  return (
    <p className="rounded-md border border-flare bg-flare-soft px-3 py-2 text-xs text-flare-ink">
      <strong>Planning aid only.</strong> These figures help decide whether a request can work; the decision to open, point or close a telescope rests
      with the night assistant and the observatory&apos;s own operating procedures and safety rules. A request that breaks a telescope&apos;s sun
      avoidance limit is refused, never scheduled.
    </p>
  );
}
