/** Pages people reach signed out, from an e-mailed link or the sign-in page. */
export default function AccountLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-dvh items-center justify-center px-4 py-10">
      <div className="w-full max-w-sm">
        <p className="mb-6 text-center text-2xl font-semibold tracking-tight">Hookeline</p>
        {children}
      </div>
    </main>
  );
}
