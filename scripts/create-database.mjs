// node scripts/create-database.mjs ADMIN_URL NAME [fresh]
// Creates database NAME on the server of ADMIN_URL when missing; with "fresh", drops it first.
import pg from "pg";

const [adminUrl, name, mode] = process.argv.slice(2);
if (!adminUrl || !name || !/^[a-z_][a-z0-9_]*$/.test(name)) {
  console.error("usage: create-database.mjs ADMIN_URL NAME [fresh]");
  process.exit(2);
}
const client = new pg.Client({ connectionString: adminUrl });
await client.connect();
try {
  if (mode === "fresh") await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  const { rowCount } = await client.query("SELECT 1 FROM pg_database WHERE datname = $1", [name]);
  if (!rowCount) await client.query(`CREATE DATABASE ${name}`);
} finally {
  await client.end();
}
