import type { Metadata } from "next";
import { SetPasswordCard } from "../../set-password-card";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetConfirmPage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return <SetPasswordCard token={token} purpose="password-reset" title="Choose a new password" />;
}
