import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="num text-xs text-muted">403</p>
      <h1 className="mt-2 text-xl font-semibold">This page needs a role you do not hold</h1>
      <p className="mt-2 text-muted">Ask an administrator of your consortium if you think you should have it.</p>
      <Link href="/" className="mt-6 inline-block underline">Back to your home</Link>
    </main>
  );
}
