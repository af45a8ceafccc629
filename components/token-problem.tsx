import Link from "next/link";

const text = {
  unknown: "This link is not valid. It may be mistyped or incomplete.",
  expired: "This link has expired.",
  used: "This link has already been used. Each link works once.",
} as const;

export function TokenProblem({ state, again }: { state: keyof typeof text; again: { href: string; label: string } }) {
  return (
    <div className="space-y-3" role="alert">
      <p className="text-sm">{text[state]} Nothing was changed.</p>
      <Link className="btn-quiet" href={again.href}>{again.label}</Link>
    </div>
  );
}
