/** Browser side of uploads: multipart POST, errors as ApiFailure like every other call. */
import { ApiFailure } from "@/components/api-client";

export async function uploadFile<T = unknown>(url: string, file: Blob, name?: string): Promise<T> {
  const form = new FormData();
  form.set("file", file, name ?? (file instanceof File ? file.name : "upload"));
  let res: Response;
  try {
    res = await fetch(url, { method: "POST", body: form });
  } catch {
    throw new ApiFailure(0, "offline", "Cannot reach the server; the file was not uploaded.");
  }
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiFailure(res.status, e.code ?? "error", e.message ?? `Upload failed (${res.status})`, e.fields, data);
  }
  return data as T;
}

export type StoredFile = {
  id: string; kind: "photo" | "pdf" | "linkage-picture"; contentType: string; size: number; name: string;
  hasThumbnail: boolean; width: number | null; height: number | null; uploadedBy: string | null; createdAt: string; url: string; thumbUrl: string | null;
};

export const ACCEPT_PHOTOS = "image/jpeg,image/png,image/webp";
export const ACCEPT_FILES = `${ACCEPT_PHOTOS},application/pdf`;
