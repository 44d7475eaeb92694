/**
 * Running an UploadThing route handler and the real browser uploader in Node, for these
 * tests and the upload fake's own (tests/unit/fakes/upload-server.test.ts): a node:http
 * server hands requests to the fetch-style handler, and a fetch-backed stand-in replaces
 * XMLHttpRequest (which Node lacks).
 */
import { createServer, type Server } from "node:http";

/** Enough of XMLHttpRequest for uploadthing/client's PUT: open, headers, send(FormData), load/error. */
export class FetchXhr {
  status = 0;
  statusText = "";
  response: unknown = null;
  responseType = "";
  readonly upload = { addEventListener: (): void => {} };
  private method = "GET";
  private url = "";
  private readonly headers = new Headers();
  private readonly listeners = new Map<string, (() => void)[]>();
  private readonly controller = new AbortController();

  open(method: string, url: string): void {
    this.method = method;
    this.url = url;
  }
  setRequestHeader(name: string, value: string): void {
    this.headers.set(name, value);
  }
  addEventListener(type: string, listener: () => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }
  abort(): void {
    this.controller.abort();
  }
  send(body: FormData): void {
    const emit = (type: string): void => this.listeners.get(type)?.forEach((listener) => listener());
    fetch(this.url, { method: this.method, headers: this.headers, body, signal: this.controller.signal }).then(
      async (response) => {
        this.status = response.status;
        this.statusText = response.statusText;
        const text = await response.text();
        try {
          this.response = JSON.parse(text) as unknown;
        } catch {
          this.response = null;
        }
        emit("load");
      },
      () => emit("error"),
    );
  }
}

export function installXhr(): () => void {
  Object.defineProperty(globalThis, "XMLHttpRequest", { value: FetchXhr, configurable: true, writable: true });
  return () => Reflect.deleteProperty(globalThis, "XMLHttpRequest");
}

export type App = { url: string; close: () => Promise<void> };

/** Serves a fetch-style handler (what createRouteHandler returns) from node:http, as Next would. */
export async function serveHandler(handler: (request: Request) => Promise<Response>): Promise<App> {
  const server: Server = createServer((req, res) => {
    void (async () => {
      const chunks: Buffer[] = [];
      for await (const chunk of req) chunks.push(chunk as Buffer);
      const headers = new Headers();
      for (const [name, value] of Object.entries(req.headers)) {
        if (typeof value === "string") headers.set(name, value);
        else if (Array.isArray(value)) value.forEach((v) => headers.append(name, v));
      }
      const hasBody = req.method !== "GET" && req.method !== "HEAD";
      const request = new Request(`http://${req.headers.host ?? "127.0.0.1"}${req.url ?? "/"}`, {
        method: req.method ?? "GET",
        headers,
        ...(hasBody ? { body: new Uint8Array(Buffer.concat(chunks)) } : {}),
      });
      const response = await handler(request);
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(Buffer.from(await response.arrayBuffer()));
    })().catch((error: unknown) => {
      res.statusCode = 500;
      res.end(String(error));
    });
  });
  await new Promise<void>((done) => server.listen(0, "127.0.0.1", done));
  const address = server.address();
  if (address === null || typeof address === "string") throw new Error("no address");
  return {
    url: `http://127.0.0.1:${address.port}`,
    close: () =>
      new Promise<void>((done) => {
        server.close(() => done());
        server.closeAllConnections();
      }),
  };
}
