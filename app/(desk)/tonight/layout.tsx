import "@/components/tonight/tonight.css";
import { cookies } from "next/headers";
import { NightVisionProvider } from "@/components/tonight/night-vision";
import { NIGHT_VISION_COOKIE, parseNightVision } from "@/lib/tonight/night-vision";

// The night-vision switch lives here so it survives moving between telescopes and nights.
// Each page checks its own role.
export default async function TonightLayout({ children }: { children: React.ReactNode }) {
  const on = parseNightVision((await cookies()).get(NIGHT_VISION_COOKIE)?.value);
  return <NightVisionProvider initialOn={on}>{children}</NightVisionProvider>;
}
