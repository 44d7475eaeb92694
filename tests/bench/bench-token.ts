// Prints a fresh API token for a demo user (default the admin) in the bench database.
import { makeBenchTokens } from "./tokens";

const [token] = await makeBenchTokens([process.argv[2] ?? "admin@nightbreak.test"]);
console.log(token);
