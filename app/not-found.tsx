import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-24 text-center">
      <h1 className="mb-2">Not found</h1>
      <p className="mb-6 text-ink-soft">There is nothing at this address, or it has been removed.</p>
      <Link href="/basins">Go to your basins</Link>
    </main>
  );
}
