// `npm run db:seed`: loads the invented demo consortium into an empty database.
import { createDb } from "../db/index";
import { DEMO_PASSWORD, DEMO_USERS, isSeeded, seedDemo } from "../db/seed";
import { hashPassword } from "../lib/auth/password";

if (!process.env.DATABASE_URL) {
  console.error("DATABASE_URL is not set (scripts/pg.sh prints it)");
  process.exit(2);
}
const db = createDb(process.env.DATABASE_URL, 2);
try {
  if (await isSeeded(db)) {
    console.log("seed: the database already has users; left as it is");
  } else {
    const { blocks, users } = await seedDemo(db, { passwordHash: await hashPassword(DEMO_PASSWORD) });
    console.log(`seed: ${users} users, ${blocks} blocks; demo sign-ins: ${DEMO_USERS.map((u) => u.email).join(", ")}`);
  }
} catch (error) {
  console.error("seed failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
