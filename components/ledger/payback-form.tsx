"use client";

/**
 * Scheduling a payback block for a program that is owed time: the telescope and the
 * slot in UT. The server refuses overlaps (naming the block in the way), any block longer
 * than what is owed, and any block not wholly between sunset and sunrise of one night at
 * the telescope's site (beside the start or end, naming that night's sunset and sunrise);
 * the message says so and nothing is saved.
 */
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { FormInput, FormSelect, type SelectOption } from "@/components/admin/form-controls";
import { FormFooter } from "@/components/admin/form-footer";
import { useSaveAction } from "@/components/admin/use-save-action";
import type { ActionResult } from "@/lib/actions/result";
import { paybackSchema, type PaybackFormValues } from "@/lib/ledger/schemas";

const EMPTY: PaybackFormValues = { programId: "", telescopeId: "", startsAt: "", endsAt: "", note: "" };

export function PaybackForm({ programs, telescopes, action }: { programs: SelectOption[]; telescopes: SelectOption[]; action: (input: unknown) => Promise<ActionResult> }) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PaybackFormValues>({ resolver: zodResolver(paybackSchema, undefined, { raw: true }), defaultValues: EMPTY });
  const { result, submit } = useSaveAction<PaybackFormValues>(action, setError, () => {
    reset(EMPTY);
    router.refresh();
  });
  if (programs.length === 0) return <p className="text-sm text-muted">No program is owed time: there is nothing to pay back.</p>;
  return (
    <form onSubmit={handleSubmit(submit)} noValidate aria-label="Schedule a payback block" className="grid gap-x-4 sm:grid-cols-2 lg:grid-cols-5">
      <FormSelect id="payback-program" label="Program owed" options={programs} error={errors.programId?.message} {...register("programId")} />
      <FormSelect id="payback-telescope" label="Telescope" options={telescopes} error={errors.telescopeId?.message} {...register("telescopeId")} />
      <FormInput id="payback-start" label="Start (UT)" type="datetime-local" className="num" error={errors.startsAt?.message} {...register("startsAt")} />
      <FormInput id="payback-end" label="End (UT)" type="datetime-local" className="num" error={errors.endsAt?.message} {...register("endsAt")} />
      <FormInput id="payback-note" label="Note (optional)" error={errors.note?.message} {...register("note")} />
      <FormFooter submitLabel="Schedule payback block" pending={isSubmitting} result={result} />
    </form>
  );
}
