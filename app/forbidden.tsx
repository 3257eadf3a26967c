import Link from "next/link";
import { buttonClass } from "@/components/ui/styles";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold">Not allowed</h1>
      <p className="mt-2 text-slate-600 dark:text-slate-400">
        Your role does not give access to this page. Ask an administrator if you need it.
      </p>
      <Link href="/" className={`${buttonClass("secondary")} mt-6`}>
        Back to structures
      </Link>
    </main>
  );
}
