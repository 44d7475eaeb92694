import type { Metadata } from "next";
import { PageHeader } from "@/components/ui/page-header";
import { AdminSection, DirectorSection, NightAssistantSection, ObserverSection, PiSection } from "@/components/home/role-sections";
import { requirePageRole } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Home" };

export default async function HomePage() {
  const user = await requirePageRole();
  const has = (role: (typeof user.roles)[number]) => user.roles.includes(role);
  return (
    <>
      <PageHeader title={`Good to see you, ${user.name.split(" ")[0]}`} />
      <div className="grid gap-4">
        {has("director") && <DirectorSection />}
        {has("night_assistant") && <NightAssistantSection userId={user.id} />}
        {has("pi") && <PiSection userId={user.id} />}
        {has("observer") && <ObserverSection userId={user.id} />}
        {has("admin") && <AdminSection />}
      </div>
    </>
  );
}
