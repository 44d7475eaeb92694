/** Said on tonight's queue, on screen and on the printed sheet. */
export const SAFETY_CAUTION =
  "Feasibility figures are planning aids; opening, pointing and closing the telescope follow the observatory's own procedures and safety rules.";

export function SafetyCaution() {
  return (
    <p role="note" className="rounded-md border border-line bg-sunken px-3 py-2 text-base">
      <strong>Caution.</strong> {SAFETY_CAUTION}
    </p>
  );
}
