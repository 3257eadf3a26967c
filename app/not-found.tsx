import Link from "next/link";
import { buttonClass } from "@/components/ui/styles";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold">Not found</h1>
      <p className="mt-2 text-slate-600 dark:text-slate-400">
        This page does not exist, or it belongs to a structure you are not a member of.
      </p>
      <Link href="/" className={`${buttonClass("secondary")} mt-6`}>
        Back to structures
      </Link>
    </main>
  );
}
