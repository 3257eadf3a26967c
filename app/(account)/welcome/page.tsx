import type { Metadata } from "next";
import { SetPasswordCard } from "../set-password-card";

export const metadata: Metadata = { title: "Welcome" };

export default async function WelcomePage({ searchParams }: { searchParams: Promise<{ token?: string }> }) {
  const { token } = await searchParams;
  return <SetPasswordCard token={token} purpose="invitation" title="Welcome to Hookeline" />;
}
