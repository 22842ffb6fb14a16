/** "Teal backdrop, warm key" → "teal-backdrop-warm-key": the file name of a download, the same from the client and the server. */
export function fileStem(title: string): string {
  return (
    title
      .normalize('NFKD')
      .replace(/[\u0300-\u036f]/g, '')
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'setup'
  );
}
