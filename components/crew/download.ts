// Downloading an export with progress: the bytes are read as they arrive (Content-Length gives the total),
// then saved under a file name. On the web a link with `download` saves the blob; a phone app opens the URL.
import { Linking, Platform } from 'react-native';

export type Progress = { loaded: number; total: number | null };

export async function downloadWithProgress(url: string, filename: string, onProgress: (p: Progress) => void, signal?: AbortSignal): Promise<void> {
  if (Platform.OS !== 'web') {
    await Linking.openURL(url);
    return;
  }
  const res = await fetch(url, { credentials: 'same-origin', signal });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new Error(body?.error?.message ?? `the server answered ${res.status}`);
  }
  const total = Number(res.headers.get('content-length')) || null;
  onProgress({ loaded: 0, total });
  const chunks: Uint8Array[] = [];
  let loaded = 0;
  const reader = res.body?.getReader();
  if (reader) {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      chunks.push(value);
      loaded += value.length;
      onProgress({ loaded, total });
    }
  } else {
    chunks.push(new Uint8Array(await res.arrayBuffer()));
  }
  const blob = new Blob(chunks as BlobPart[], { type: res.headers.get('content-type') ?? 'application/octet-stream' });
  const href = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = href;
  a.download = filename;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
}

export const kb = (n: number) => `${Math.max(1, Math.round(n / 1024))} KB`;

/** Copy text to the clipboard where the platform lets us; false when it does not. */
export async function copyText(text: string): Promise<boolean> {
  try {
    if (Platform.OS === 'web' && navigator.clipboard) {
      await navigator.clipboard.writeText(text);
      return true;
    }
  } catch {
    /* permission refused: the caller shows the text to copy by hand */
  }
  return false;
}
