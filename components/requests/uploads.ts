"use client";

import { generateReactHelpers } from "@uploadthing/react";
import type { AttachmentRouter } from "@/lib/attachments/router";

/** UploadThing's React hook, typed by our file router; it talks to /api/uploadthing. */
export const { useUploadThing } = generateReactHelpers<AttachmentRouter>();
