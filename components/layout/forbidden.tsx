export function Forbidden({ message }: { message: string }) {
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1 className="text-lg font-semibold">Not available to your role</h1>
      <p role="alert" className="mt-2 text-sm text-danger">
        ⛔ {message}
      </p>
      <p className="mt-2 text-sm text-muted">Ask a workspace owner if you need this.</p>
    </main>
  );
}
