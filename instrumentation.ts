export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startServerServices } = await import("./jobs/server-start");
  await startServerServices();
}
