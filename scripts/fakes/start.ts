/**
 * Starts the local e-mail and upload fakes together for the demo and test scripts.
 * Configuration comes from the same env variables as each fake (FAKE_EMAIL_*,
 * FAKE_UPLOAD_*, UPLOADTHING_TOKEN). Prints one `NAME=value` line per URL so a
 * shell script can wait for them, then runs until SIGTERM or SIGINT.
 */
import { startEmailFake } from "./email-server";
import { startUploadFake } from "./upload-server";

const email = await startEmailFake();
const upload = await startUploadFake().catch(async (error: unknown) => {
  await email.close();
  throw error;
});

console.log(`FAKE_EMAIL_URL=${email.url}`);
console.log(`FAKE_UPLOAD_URL=${upload.url}`);
console.log("fakes ready");

let stopping = false;
const stop = (): void => {
  if (stopping) return;
  stopping = true;
  void Promise.all([email.close(), upload.close()]).then(
    () => process.exit(0),
    () => process.exit(1),
  );
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
