// The OpenAPI document covers every /api/v1 route and method that exists: a new
// route.ts under app/api/v1 without a path in lib/openapi/paths fails here.
import { readdir, readFile } from "node:fs/promises";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { buildOpenApiDocument } from "@/lib/openapi/document";

const ROOT = join(process.cwd(), "app", "api", "v1");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

async function routeFiles(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true });
  const nested = await Promise.all(entries.map((e) => (e.isDirectory() ? routeFiles(join(dir, e.name)) : Promise.resolve(e.name === "route.ts" ? [join(dir, e.name)] : []))));
  return nested.flat();
}

async function routes(): Promise<{ path: string; method: string }[]> {
  const found: { path: string; method: string }[] = [];
  for (const file of await routeFiles(ROOT)) {
    const segments = relative(ROOT, file).split(sep).slice(0, -1);
    const path = `/api/v1/${segments.map((s) => s.replace(/^\[(.+)\]$/, "{$1}")).join("/")}`;
    const source = await readFile(file, "utf8");
    for (const method of METHODS) {
      if (new RegExp(`export (const|async function|function) ${method}\\b`).test(source)) found.push({ path, method: method.toLowerCase() });
    }
  }
  return found;
}

describe("the OpenAPI document", () => {
  it("is OpenAPI 3.1 with bearer-token security", () => {
    const doc = buildOpenApiDocument();
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.components?.securitySchemes?.bearerAuth).toMatchObject({ type: "http", scheme: "bearer" });
  });

  it("documents every route and method under app/api/v1", async () => {
    const doc = buildOpenApiDocument();
    const documented = new Set(Object.entries(doc.paths ?? {}).flatMap(([path, item]) => Object.keys(item ?? {}).map((m) => `${m} ${path}`)));
    const existing = await routes();
    expect(existing.length).toBeGreaterThan(10);
    const missing = existing.map((r) => `${r.method} ${r.path}`).filter((key) => !documented.has(key));
    expect(missing, "add these to lib/openapi/paths/*").toEqual([]);
  });

  it("describes the ToO request body from the same zod schema the API validates with", () => {
    const doc = buildOpenApiDocument();
    const post = doc.paths?.["/api/v1/too-requests"]?.post;
    expect(post?.parameters?.some((p) => "name" in p && p.name === "Idempotency-Key" && p.in === "header")).toBe(true);
    const input = doc.components?.schemas?.TooRequestInput as { required?: string[]; properties?: Record<string, unknown> } | undefined;
    expect(input?.required).toEqual(expect.arrayContaining(["programId", "targetName", "target", "telescopeIds", "instrumentId", "urgency", "justification"]));
    expect(Object.keys(doc.paths?.["/api/v1/too-requests/{id}"] ?? {})).toEqual(["get"]);
  });
});
