/** SWR's fetcher for the app's own calls to /api/v1 (the browser's session authenticates them). */
export async function fetchJson<T>(url: string): Promise<T> {
  const response = await fetch(url, { headers: { accept: "application/json" } });
  const body = await response.json().catch(() => null);
  if (!response.ok) throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  return body as T;
}

/** Downloads a resource through fetch, so headers like Accept: text/csv can be set. */
export async function downloadFile(url: string, accept: string, filename: string): Promise<void> {
  const response = await fetch(url, { headers: { accept } });
  if (!response.ok) throw new Error((await response.json().catch(() => null))?.error?.message ?? `The server answered ${response.status}.`);
  const link = document.createElement("a");
  link.href = URL.createObjectURL(await response.blob());
  link.download = filename;
  link.click();
  URL.revokeObjectURL(link.href);
}
