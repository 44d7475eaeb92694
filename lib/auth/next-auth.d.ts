import type { Role } from "@/db/types";

declare module "next-auth" {
  interface User {
    roles: Role[];
  }
  interface Session {
    user?: { id: string; name?: string | null; email?: string | null; roles: Role[] };
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid: string;
    roles: Role[];
  }
}
