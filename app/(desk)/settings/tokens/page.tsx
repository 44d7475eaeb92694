import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { CreateTokenForm } from "@/components/api-tokens/create-token-form";
import { TokenList } from "@/components/api-tokens/token-list";
import { PageHeader } from "@/components/ui/page-header";
import { listApiTokens } from "@/lib/api-tokens/queries";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { requirePageRole } from "@/lib/auth/session";
import { createTokenAction, revokeTokenAction } from "./actions";

export const metadata: Metadata = { title: "API tokens" };

export default async function TokensPage() {
  const user = await requirePageRole();
  const tokens = await listApiTokens(getDb(), user.id);
  return (
    <>
      <PageHeader title="API tokens" />
      <div className="flex max-w-3xl flex-col gap-6">
        <p className="text-sm">
          A token lets a script or an alert pipeline use the <a href="/api/v1/openapi.json" className="underline">Nightbreak API</a> as you, with your roles (
          {user.roles.map((r) => ROLE_LABELS[r]).join(", ")}). Send it as <code className="num">Authorization: Bearer nbk_…</code>. Revoke a token as soon as
          it is no longer needed or may have leaked.
        </p>
        <section aria-labelledby="new-token" className="rounded-lg border border-line bg-raised p-4">
          <h2 id="new-token" className="mb-3 font-semibold">
            New token
          </h2>
          <CreateTokenForm action={createTokenAction} />
        </section>
        <section aria-labelledby="your-tokens" className="flex flex-col gap-3">
          <h2 id="your-tokens" className="font-semibold">
            Your tokens
          </h2>
          <TokenList tokens={tokens} revoke={revokeTokenAction} />
        </section>
      </div>
    </>
  );
}
