/** Asks the API to delete an uploaded file; the server's refusal reason, or null when it is gone. */
export async function deleteUploadedFile(url: string): Promise<string | null> {
  try {
    const response = await fetch(url, { method: "DELETE" });
    if (response.ok) return null;
    const body = await response.json().catch(() => null);
    return body?.error?.message ?? `The file was not deleted (HTTP ${response.status}).`;
  } catch {
    return "The file was not deleted: the server could not be reached. Try again.";
  }
}
