import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { AppHeader } from "@/components/layout/app-header";
import { getCurrentUser } from "@/lib/auth/session";
import { parseTheme, THEME_COOKIE } from "@/lib/theme";

// Every page below also checks its own role: this layout only draws the frame.
export default async function DeskLayout({ children }: { children: React.ReactNode }) {
  const user = await getCurrentUser();
  if (!user) redirect("/sign-in");
  const theme = parseTheme((await cookies()).get(THEME_COOKIE)?.value);
  return (
    <>
      <AppHeader user={user} theme={theme} />
      <main className="mx-auto max-w-7xl px-4 py-6">{children}</main>
    </>
  );
}
