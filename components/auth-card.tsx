export function AuthCard({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-plate-sunk p-4">
      <div className="w-full max-w-sm rounded-lg border border-plate-line bg-plate-raised p-6 shadow-sm">
        <p className="text-sm font-semibold tracking-tight text-phosphate">Coatwright</p>
        <h1 className="mb-4 mt-1">{title}</h1>
        {children}
      </div>
    </main>
  );
}
