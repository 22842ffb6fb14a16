/** "Teal backdrop, warm key" → "teal-backdrop-warm-key", for download file names (the server names them alike). */
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
