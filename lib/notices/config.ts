/**
 * How e-mail delivery retries and how eagerly workers look for work. Production values
 * are the defaults; tests and the benchmark shorten them through the same env variables
 * (so a worker started as a child process can be tuned too).
 *
 * pg-boss backoff: the n-th retry waits between retryDelay·2^(n-1) and retryDelay·2^n
 * seconds, so 8 retries from 5 s span roughly 20 to 40 minutes in all.
 */
export interface DeliveryPolicy {
  retryLimit: number;
  retryDelaySeconds: number;
  retryBackoff: boolean;
  /** A job active longer than this (its worker crashed) is handed out again. */
  expireInSeconds: number;
  /** How often an idle worker looks for due jobs; new jobs also wake it through LISTEN. */
  pollingIntervalSeconds: number;
  /** How often expired jobs are found (pg-boss maintenance). */
  maintenanceIntervalSeconds: number;
  /** Jobs handled at once by one worker process. */
  concurrency: number;
  /** One HTTP call to the mail service; a timeout counts as a retryable failure. */
  sendTimeoutMs: number;
}

export const DEFAULT_POLICY: DeliveryPolicy = {
  retryLimit: 8,
  retryDelaySeconds: 5,
  retryBackoff: true,
  expireInSeconds: 60,
  pollingIntervalSeconds: 2,
  maintenanceIntervalSeconds: 30,
  concurrency: 4,
  sendTimeoutMs: 15_000,
};

function num(env: Record<string, string | undefined>, name: string, fallback: number, min: number): number {
  const raw = env[name];
  if (raw === undefined || raw.trim() === "") return fallback;
  const value = Number(raw);
  if (!Number.isFinite(value) || value < min) throw new Error(`${name} must be a number of at least ${min}, got '${raw}'`);
  return value;
}

export function policyFromEnv(env: Record<string, string | undefined> = process.env): DeliveryPolicy {
  const d = DEFAULT_POLICY;
  return {
    retryLimit: Math.round(num(env, "NOTICE_RETRY_LIMIT", d.retryLimit, 0)),
    retryDelaySeconds: Math.round(num(env, "NOTICE_RETRY_DELAY_SECONDS", d.retryDelaySeconds, 0)),
    retryBackoff: env.NOTICE_RETRY_BACKOFF ? env.NOTICE_RETRY_BACKOFF !== "off" : d.retryBackoff,
    expireInSeconds: Math.round(num(env, "NOTICE_EXPIRE_SECONDS", d.expireInSeconds, 1)),
    pollingIntervalSeconds: num(env, "NOTICE_POLL_SECONDS", d.pollingIntervalSeconds, 0.5),
    maintenanceIntervalSeconds: Math.round(num(env, "NOTICE_MAINTENANCE_SECONDS", d.maintenanceIntervalSeconds, 1)),
    concurrency: Math.round(num(env, "NOTICE_CONCURRENCY", d.concurrency, 1)),
    sendTimeoutMs: num(env, "NOTICE_SEND_TIMEOUT_MS", d.sendTimeoutMs, 100),
  };
}
