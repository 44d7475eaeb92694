import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { RequestForm } from "@/components/requests/request-form";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { emptyRequestForm } from "@/lib/requests/form-values";
import { saveDraftAction, submitRequestAction } from "../actions";
import { loadFormOptions } from "@/lib/requests/form-options";

export const metadata: Metadata = { title: "New ToO request" };

export default async function NewRequestPage() {
  const user = await requirePageRole("pi");
  const options = await loadFormOptions(getDb(), user.id);
  return (
    <>
      <PageHeader title="New ToO request" />
      <RequestForm
        draftId={null}
        initial={emptyRequestForm(new Date(), options.programs.map((p) => p.id))}
        attachments={[]}
        saveDraft={saveDraftAction}
        submit={submitRequestAction}
        {...options}
      />
    </>
  );
}
