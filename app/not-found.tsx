// A plain link: next/link here would put a second copy of its client code in every page's first load.
export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1>Not found</h1>
      <p className="mt-2 text-ink-soft">There is nothing at this address. It may have been archived or the link is mistyped.</p>
      <a className="btn-quiet mt-4" href="/">Back to today&apos;s plan</a>
    </main>
  );
}
