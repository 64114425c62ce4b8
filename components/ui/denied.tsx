import Link from "next/link";

export function Denied({ message }: { message: string }) {
  return (
    <div className="card max-w-xl">
      <h1 className="mb-2">Not available to you</h1>
      <p className="mb-4 text-ink-soft">{message}</p>
      <Link href="/basins">Back to your basins</Link>
    </div>
  );
}
