/**
 * No secret reaches the browser: every file of the built client bundle (.next/static) is
 * read and searched for the secrets the server runs with. scripts/test.sh and
 * scripts/services.sh export them before `npx playwright test`, whose workers inherit them.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { expect, test } from "@playwright/test";
import { parseUploadThingToken } from "../../lib/uploads/token";

const STATIC = fileURLToPath(new URL("../../.next/static", import.meta.url));

function secrets(): Record<string, string> {
  const found: Record<string, string> = {};
  const put = (name: string, value: string | undefined) => {
    // Short values would match by chance; none of the real secrets is short.
    if (value && value.length >= 8) found[name] = value;
  };
  put("NEXTAUTH_SECRET", process.env.NEXTAUTH_SECRET);
  put("RESEND_API_KEY", process.env.RESEND_API_KEY);
  if (process.env.DATABASE_URL) put("the DATABASE_URL password", decodeURIComponent(new URL(process.env.DATABASE_URL).password));
  if (process.env.UPLOADTHING_TOKEN) {
    put("UPLOADTHING_TOKEN", process.env.UPLOADTHING_TOKEN);
    put("the UploadThing apiKey", parseUploadThingToken(process.env.UPLOADTHING_TOKEN).apiKey);
  }
  return found;
}

test("the client bundle holds none of the server's secrets", () => {
  const wanted = secrets();
  // The run exports all of them; a missing one would make this test pass for nothing.
  expect(Object.keys(wanted).sort()).toEqual(["NEXTAUTH_SECRET", "RESEND_API_KEY", "UPLOADTHING_TOKEN", "the DATABASE_URL password", "the UploadThing apiKey"].sort());

  const files = readdirSync(STATIC, { recursive: true, encoding: "utf8" }).map((f) => path.join(STATIC, f)).filter((f) => statSync(f).isFile());
  expect(files.length).toBeGreaterThan(10);
  const leaks: string[] = [];
  for (const file of files) {
    const content = readFileSync(file).toString("latin1");
    for (const [name, value] of Object.entries(wanted)) if (content.includes(value)) leaks.push(`${name} in ${path.relative(STATIC, file)}`);
  }
  expect(leaks).toEqual([]);
});
