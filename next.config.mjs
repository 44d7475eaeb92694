/**
 * Security headers for every response. Next.js evaluates headers() when it builds (the
 * result goes into the build's routes manifest), so anything read from the environment
 * here is read at build time — before the local fakes have chosen their ports. Hence
 * fixed host patterns below rather than UPLOADTHING_INGEST_URL.
 */
const isProduction = process.env.NODE_ENV === "production";

// UploadThing: the browser PUTs files to `<region>.ingest.uploadthing.com` and files are
// served from `<app>.ufs.sh` (and the older utfs.io). The local fake listens on a free
// loopback port chosen at start (scripts/services.sh), so any loopback port is allowed.
const UPLOAD_INGEST = ["https://*.ingest.uploadthing.com", "http://127.0.0.1:*"];
const UPLOAD_FILES = ["https://*.ufs.sh", "https://utfs.io"];

const contentSecurityPolicy = [
  "default-src 'self'",
  // Next's App Router streams its bootstrap and flight data as inline <script>s; without a
  // per-request nonce (which would need middleware and make every page dynamic) they need
  // 'unsafe-inline'. `next dev` also evaluates code for React's debugging aids.
  `script-src 'self' 'unsafe-inline'${isProduction ? "" : " 'unsafe-eval'"}`,
  // FullCalendar injects its stylesheet at run time; React writes style attributes.
  "style-src 'self' 'unsafe-inline'",
  `img-src 'self' data: blob: ${UPLOAD_FILES.join(" ")}`,
  // FullCalendar's icon font ships inside its CSS as a data: URL.
  "font-src 'self' data:",
  `connect-src 'self' ${UPLOAD_INGEST.join(" ")} ${UPLOAD_FILES.join(" ")}`,
  // The admin outbox shows an e-mail's HTML in a sandboxed srcdoc iframe.
  "frame-src 'self'",
  "frame-ancestors 'none'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
].join("; ");

/** HSTS only for a production build served over https: never on loopback http. */
function strictTransportSecurity() {
  if (!isProduction) return [];
  let url;
  try {
    url = new URL(process.env.NEXTAUTH_URL ?? process.env.APP_URL ?? "");
  } catch {
    return [];
  }
  const loopback = ["localhost", "127.0.0.1", "[::1]"].includes(url.hostname);
  return url.protocol === "https:" && !loopback ? [{ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" }] : [];
}

/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // Compression belongs to the load balancer in front (README, Operations); the schedule API
  // gzips its large answers once per schedule version itself (lib/schedule/schedule-cache.ts).
  compress: false,
  reactStrictMode: true,
  // forbidden() / unauthorized() give signed-in users without a role a real 403 page.
  experimental: { authInterrupts: true },
  serverExternalPackages: ["pg", "pg-boss", "bcryptjs", "rate-limiter-flexible"],
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: contentSecurityPolicy },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
          ...strictTransportSecurity(),
        ],
      },
    ];
  },
};

export default nextConfig;
