import { z } from "zod";
import { ROLES } from "@/db/types";
import { passwordSchema } from "@/lib/auth/password";

export const roleSchema = z.enum(ROLES);

export const createUserSchema = z.object({
  name: z.string().trim().min(1, "Enter the person's name.").max(200, "Use at most 200 characters."),
  email: z.string().trim().toLowerCase().email("Enter a valid e-mail address."),
  password: passwordSchema,
  roles: z.array(roleSchema).min(1, "Give the user at least one role."),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

export const updateRolesSchema = z.object({
  userId: z.string().uuid("Unknown user."),
  roles: z.array(roleSchema),
});
export type UpdateRolesInput = z.infer<typeof updateRolesSchema>;
