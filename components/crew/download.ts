// Downloading an export with progress: the bytes are read as they arrive (Content-Length gives the total),
// then saved under a file name (the given one, else the server's Content-Disposition). On the web a link with
// `download` saves the blob; a phone app opens the URL. Every download in the app goes through here.
import { Linking, Platform } from 'react-native';
import { fetchFile } from '../../hooks/api';

export type Progress = { loaded: number; total: number | null };

/** A file made from a request body (a POST), rather than one a URL names. */
export type FileRequest = { url: string; method: 'POST'; body: unknown };

export async function downloadWithProgress(request: string | FileRequest, filename: string | null, onProgress: (p: Progress) => void, signal?: AbortSignal): Promise<void> {
  const url = typeof request === 'string' ? request : request.url;
  if (Platform.OS !== 'web') {
    if (typeof request !== 'string') throw new Error('this file downloads in the web app for now');
    await Linking.openURL(url);
    return;
  }
  const res = await fetchFile(url, signal, typeof request === 'string' ? undefined : { method: request.method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(request.body) });
  const name = filename ?? /filename="([^"]+)"/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? url.split('/').pop() ?? 'download';
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
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
}

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
