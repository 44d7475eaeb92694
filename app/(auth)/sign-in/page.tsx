import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Logo } from "@/components/ui/logo";
import { getCurrentUser } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Sign in" };

// Only same-site paths may follow a sign-in: never an absolute URL from the query string.
function safeNext(value: string | string[] | undefined): string {
  return typeof value === "string" && value.startsWith("/") && !value.startsWith("//") ? value : "/";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const params = await searchParams;
  const next = safeNext(params.callbackUrl ?? params.next);
  if (await getCurrentUser()) redirect(next);
  return (
    <main className="grid min-h-screen md:grid-cols-[1.1fr_1fr]">
      <section
        aria-hidden="true"
        className="relative hidden overflow-hidden bg-gradient-to-b from-dusk-1 via-dusk-3 to-dusk-4 md:block"
      >
        <div className="absolute inset-x-0 bottom-0 h-1/3 bg-gradient-to-t from-black/70 to-transparent" />
        <div className="absolute bottom-[33%] left-[58%] h-2 w-2 rounded-full bg-flare shadow-[0_0_24px_8px_rgba(232,101,12,0.55)]" />
        <div className="absolute bottom-10 left-10 max-w-sm text-[#dfe6f3]">
          <p className="text-2xs uppercase tracking-[0.25em] text-[#9fb0cf]">Override desk</p>
          <p className="mt-2 text-lg leading-snug">
            When the sky changes its plans, the schedule follows — checked, decided, announced and paid back.
          </p>
        </div>
      </section>
      <section className="flex items-center justify-center px-6 py-12">
        <div className="w-full max-w-sm">
          <div className="mb-8 flex items-center gap-3">
            <Logo className="h-9 w-9" />
            <div>
              <h1 className="text-xl font-semibold tracking-tight">Nightbreak</h1>
              <p className="text-xs text-muted">Sign in to the consortium&apos;s override desk</p>
            </div>
          </div>
          <SignInForm next={next} />
        </div>
      </section>
    </main>
  );
}
