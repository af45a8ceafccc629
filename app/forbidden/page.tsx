import Link from "next/link";

export const metadata = { title: "Not for your role" };

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1>Not for your role</h1>
      <p className="mt-2 text-ink-soft">Your role does not give access to that page. Ask an admin if you need it.</p>
      <Link className="btn-quiet mt-4" href="/">Back to today&apos;s plan</Link>
    </main>
  );
}
