import { inject } from "vitest";

// db/index.ts reads DATABASE_URL on first use: point it at this run's fresh database.
process.env.DATABASE_URL = inject("databaseUrl");
