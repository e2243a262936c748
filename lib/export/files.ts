/** File names and download responses for an export's files. */
export function exportFileName(proofId: number, exportId: number, kind: string, ext: string): string {
  return `cairn-proof-${proofId}-export-${exportId}-${kind}.${ext}`;
}

export function download(body: BodyInit, type: string, fileName: string): Response {
  return new Response(body, {
    headers: {
      "content-type": type,
      "content-disposition": `attachment; filename="${fileName}"`,
      "cache-control": "private, no-store",
      "x-content-type-options": "nosniff",
    },
  });
}
