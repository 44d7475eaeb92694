import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { CreateUserForm } from "@/components/admin/create-user-form";
import { RoleEditor } from "@/components/admin/role-editor";
import { PageHeader } from "@/components/ui/page-header";
import { requirePageRole } from "@/lib/auth/session";
import { listUsers } from "@/lib/users/queries";
import { createUserAction, updateRolesAction } from "./actions";

export const metadata: Metadata = { title: "Users and roles" };

export default async function UsersPage() {
  await requirePageRole("admin");
  const users = await listUsers(getDb());
  return (
    <>
      <PageHeader title="Users and roles" />
      <section className="mb-8 rounded-lg border border-line bg-raised p-4">
        <h2 className="mb-3 font-semibold">New user</h2>
        <CreateUserForm action={createUserAction} />
      </section>
      <table className="w-full text-left">
        <thead className="text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th className="py-1 font-medium">Name</th>
            <th className="py-1 font-medium">E-mail</th>
            <th className="py-1 font-medium">Roles</th>
          </tr>
        </thead>
        <tbody>
          {users.map((u) => (
            <tr key={u.id} className="border-t border-line align-top">
              <td className="py-2 pr-3">{u.name}{u.disabled && <span className="ml-2 text-2xs text-muted">(disabled)</span>}</td>
              <td className="num py-2 pr-3">{u.email}</td>
              <td className="py-2"><RoleEditor userId={u.id} userName={u.name} initial={u.roles} action={updateRolesAction} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
