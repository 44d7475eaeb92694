import { redirect } from "next/navigation";
import { requirePageRole } from "@/lib/auth/session";

// Settings has one page so far: personal API tokens.
export default async function SettingsPage() {
  await requirePageRole();
  redirect("/settings/tokens");
}
