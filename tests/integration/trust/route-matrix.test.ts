/**
 * The authorization matrix for route handlers: every `route.ts` under `app/` (found on
 * disk at test time) and every HTTP method it exports, called directly for anonymous,
 * each role and a revoked token. Bodies are empty and ids random, so an allowed caller may
 * get any answer except 401 or 403; the point is who gets past the door.
 */
import { randomUUID } from "node:crypto";
import { readdirSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/db/types";
import { makeToken, makeUser } from "../fixtures";
import { ROUTE_EXCLUSIONS, ROUTE_RULES, type Method, type Rule } from "./route-rules";

const APP = path.resolve(__dirname, "../../../app");
const METHODS: Method[] = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"];

type Handler = (request: Request, route: { params: Promise<Record<string, string>> }) => Promise<Response>;

function routeFiles(): string[] {
  return readdirSync(APP, { recursive: true, encoding: "utf8" })
    .filter((file) => path.basename(file) === "route.ts")
    .map((file) => path.dirname(file).split(path.sep).join("/"))
    .sort();
}

async function exportedMethods(route: string): Promise<Map<Method, Handler>> {
  const mod = (await import(path.join(APP, route, "route.ts"))) as Record<string, unknown>;
  const found = new Map<Method, Handler>();
  for (const method of METHODS) {
    const value = mod[method];
    if (typeof value === "function") found.set(method, value as Handler);
  }
  return found;
}

function call(handler: Handler, route: string, method: Method, token?: string): Promise<Response> {
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (token) headers.authorization = `Bearer ${token}`;
  const hasBody = method !== "GET" && method !== "HEAD";
  const request = new Request(`http://127.0.0.1/${route.replace(/\[[^\]]+\]/g, randomUUID())}`, { method, headers, body: hasBody ? "{}" : undefined });
  const params: Record<string, string> = {};
  for (const match of route.matchAll(/\[([^\]]+)\]/g)) params[match[1]!] = randomUUID();
  return handler(request, { params: Promise.resolve(params) });
}

const routes = routeFiles();
const tokens = {} as Record<Role, string>;
let revoked = "";

beforeAll(async () => {
  for (const role of ROLES) tokens[role] = await makeToken((await makeUser([role])).id);
  revoked = await makeToken((await makeUser([...ROLES])).id, { revoked: true });
});

describe("the route rules", () => {
  it("finds the route handlers on disk", () => {
    expect(routes).toContain("api/v1/too-requests");
    expect(routes.length).toBeGreaterThan(20);
  });

  it("has a rule (or a reasoned exclusion) for every route file and every method it exports", async () => {
    const missing: string[] = [];
    for (const route of routes) {
      if (route in ROUTE_EXCLUSIONS) continue;
      const rules = ROUTE_RULES[route];
      for (const method of (await exportedMethods(route)).keys()) {
        if (!rules?.[method]) missing.push(`${method} ${route}`);
      }
    }
    expect(missing, "route handlers without a rule in tests/integration/trust/route-rules.ts").toEqual([]);
  });

  it("has no rule for a route or method that no longer exists", async () => {
    const stale: string[] = [];
    for (const [route, rules] of Object.entries(ROUTE_RULES)) {
      const methods = routes.includes(route) ? await exportedMethods(route) : new Map();
      for (const method of Object.keys(rules)) if (!methods.has(method)) stale.push(`${method} ${route}`);
    }
    for (const route of Object.keys(ROUTE_EXCLUSIONS)) if (!routes.includes(route)) stale.push(route);
    expect(stale).toEqual([]);
  });
});

function allows(rule: Rule, role: Role): boolean {
  return rule === "public" || rule.length === 0 || rule.includes(role);
}

const cells = Object.entries(ROUTE_RULES).flatMap(([route, rules]) =>
  Object.entries(rules).map(([method, rule]) => ({ route, method: method as Method, rule: rule as Rule })),
);

describe.each(cells.map((cell) => [`${cell.method} /${cell.route}`, cell] as const))("%s", (_name, { route, method, rule }) => {
  async function handler(): Promise<Handler> {
    const found = (await exportedMethods(route)).get(method);
    if (!found) throw new Error(`${route} exports no ${method}`);
    return found;
  }

  it(rule === "public" ? "answers without credentials" : "answers 401 to anonymous and to a revoked token", async () => {
    const h = await handler();
    const anonymous = await call(h, route, method);
    if (rule === "public") {
      expect([401, 403]).not.toContain(anonymous.status);
      return;
    }
    expect(anonymous.status).toBe(401);
    expect((await call(h, route, method, revoked)).status).toBe(401);
  });

  it.each([...ROLES])("lets a %s through only when the rule allows it", async (role) => {
    const response = await call(await handler(), route, method, tokens[role]);
    if (allows(rule, role)) expect([401, 403], `${role} should pass, got ${response.status}`).not.toContain(response.status);
    else expect(response.status).toBe(403);
  });
});
