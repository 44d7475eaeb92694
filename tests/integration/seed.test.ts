import { describe, expect, it } from "vitest";
import { createDb } from "@/db/index";
import { migrateToLatest } from "@/db/migrate";
import { DEMO_USERS, seedDemo } from "@/db/seed";
import { inject } from "vitest";
import pg from "pg";

describe("the demo seed", () => {
  it("creates one user per role and a block every night from 30 days before today to 150 days after", async () => {
    const name = `nightbreak_seed_${process.pid}`;
    const admin = new pg.Client({ connectionString: inject("adminUrl") });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await admin.query(`CREATE DATABASE ${name}`);
    const url = new URL(inject("adminUrl"));
    url.pathname = `/${name}`;
    const db = createDb(url.toString(), 1);
    try {
      await migrateToLatest(db);
      const today = new Date("2027-03-10T00:00:00Z");
      // Any valid bcrypt string will do here: sign-in is tested elsewhere.
      const { blocks } = await seedDemo(db, { today, passwordHash: "$2b$11$C6UzMDM.H6dfI/f/IKcEeO5kT0dZx1dVq9hfXcJm0Qp1A0yTq8i3K" });
      expect(blocks).toBeGreaterThan(1000);

      const roles = await db.selectFrom("user_roles").innerJoin("users", "users.id", "user_roles.user_id").select(["email", "role"]).execute();
      for (const demo of DEMO_USERS) {
        expect(roles.filter((r) => r.email === demo.email).map((r) => r.role)).toEqual(demo.roles);
      }

      const telescopes = await db.selectFrom("telescopes").select(["id", "code"]).execute();
      expect(telescopes).toHaveLength(3);
      for (const t of telescopes) {
        const rows = await db.selectFrom("blocks").select(["starts_at"]).where("telescope_id", "=", t.id).execute();
        const days = new Set(rows.map((r) => Math.floor((r.starts_at.getTime() - today.getTime()) / 86_400_000)));
        // Every night from day -30 to day +150 has at least one block starting in it (UTC days; a night may start just after 0h UT).
        const missing = [];
        for (let d = -29; d <= 149; d++) if (!days.has(d) && !days.has(d + 1)) missing.push(d);
        expect(missing, `${t.code} nights without blocks`).toEqual([]);
      }
    } finally {
      await db.destroy();
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await admin.end();
    }
  });
});
