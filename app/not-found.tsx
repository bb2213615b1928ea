import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1 className="text-lg font-semibold">Not found</h1>
      <p className="mt-2 text-sm text-muted">This page does not exist, or you are not a member of the workspace it belongs to.</p>
      <Link className="mt-4 inline-block text-sm text-accent underline" href="/">Go to your workspaces</Link>
    </main>
  );
}
