import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="num text-xs text-muted">404</p>
      <h1 className="mt-2 text-xl font-semibold">Nothing here</h1>
      <p className="mt-2 text-muted">The page or record you asked for does not exist, or was removed.</p>
      <Link href="/" className="mt-6 inline-block underline">Back to your home</Link>
    </main>
  );
}
