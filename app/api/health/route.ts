import { getDb } from "@/db/index";
import { checkHealth } from "@/lib/health/check";

export const dynamic = "force-dynamic";

// Public on purpose (load balancers call it); it reveals no data, only whether the database answers.
export async function GET() {
  const health = await checkHealth(getDb());
  return Response.json(health, { status: health.status === "ok" ? 200 : 503, headers: { "Cache-Control": "no-store" } });
}
