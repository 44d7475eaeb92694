import type { CheckboxOption } from "@/components/ui/checkbox-list";

/**
 * Everyone who may be chosen, plus those already chosen who since lost the role or were
 * disabled: unticking them must stay possible.
 */
export function peopleOptions(holders: ReadonlyArray<{ id: string; name: string }>, chosen: ReadonlyArray<{ id: string; name: string }> = []): CheckboxOption[] {
  const options = holders.map((p) => ({ value: p.id, label: p.name }));
  for (const p of chosen) if (!options.some((o) => o.value === p.id)) options.push({ value: p.id, label: `${p.name} (no longer holds the role)` });
  return options;
}
