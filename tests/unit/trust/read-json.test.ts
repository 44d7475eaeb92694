/**
 * readJson, the one door every JSON body comes through: oversized bodies answer 413
 * (counted in UTF-8 bytes, and refused on a declared Content-Length before reading),
 * malformed ones 400, and every JSON text under the limit comes back as its value.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/api/errors";
import { readJson } from "@/lib/api/handler";

const post = (body: string, headers: Record<string, string> = {}) => new Request("http://127.0.0.1/api/v1/x", { method: "POST", body, headers });

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

describe("readJson", () => {
  it("returns any JSON value sent under the limit", async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (value) => {
        const text = JSON.stringify(value);
        expect(await readJson(post(text), Buffer.byteLength(text) + 1)).toEqual(JSON.parse(text));
      }),
      { numRuns: 200 },
    );
  });

  it("answers 400 to text that is not JSON", async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: "grapheme", maxLength: 200 }), async (text) => {
        let isJson = true;
        try {
          JSON.parse(text);
        } catch {
          isJson = false;
        }
        fc.pre(!isJson);
        const error = await failure(readJson(post(text)));
        expect([error.status, error.code]).toEqual([400, "invalid_json"]);
      }),
      { numRuns: 200 },
    );
  });

  it("answers 400 to a valid body cut short", async () => {
    await fc.assert(
      fc.asyncProperty(fc.dictionary(fc.string(), fc.jsonValue(), { minKeys: 1 }), fc.nat(), async (value, cut) => {
        const text = JSON.stringify(value);
        const error = await failure(readJson(post(text.slice(0, cut % text.length))));
        expect(error.status).toBe(400);
      }),
      { numRuns: 200 },
    );
  });

  it("answers 413 to any body over the limit, counted in UTF-8 bytes", async () => {
    await fc.assert(
      fc.asyncProperty(fc.string({ unit: "grapheme", minLength: 1, maxLength: 300 }), async (inner) => {
        const text = JSON.stringify(inner);
        const bytes = Buffer.byteLength(text);
        const error = await failure(readJson(post(text), bytes - 1));
        expect([error.status, error.code]).toEqual([413, "too_large"]);
        expect(await readJson(post(text), bytes)).toBe(inner);
      }),
      { numRuns: 200 },
    );
  });

  it("counts bytes, not characters: three-byte characters under the character count are still too large", async () => {
    const text = JSON.stringify("€".repeat(400));
    expect(text.length).toBeLessThan(1000);
    expect((await failure(readJson(post(text), 1000))).status).toBe(413);
  });

  it("refuses a declared Content-Length over the limit without reading the body", async () => {
    const request = post("{}", { "content-length": "5000000" });
    expect((await failure(readJson(request, 1_000_000))).status).toBe(413);
    expect(request.bodyUsed).toBe(false);
  });
});
