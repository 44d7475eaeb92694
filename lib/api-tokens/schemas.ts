import { z } from "zod";

export const createTokenSchema = z.object({
  name: z
    .string({ error: "Name the token after what will use it." })
    .trim()
    .min(1, "Name the token after what will use it, e.g. “alert pipeline”.")
    .max(80, "Use at most 80 characters."),
});
export type CreateTokenInput = z.infer<typeof createTokenSchema>;

export const revokeTokenSchema = z.object({ id: z.uuid("Unknown token.") });
