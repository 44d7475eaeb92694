import Link from "next/link";

export function AdminBackLink() {
  return (
    <Link href="/admin" className="text-sm text-muted underline hover:text-text">
      All administration
    </Link>
  );
}
