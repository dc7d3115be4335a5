/** What may be uploaded together: one .xlsx workbook, or any number of .csv files. */
export function acceptedFiles(files: readonly { name: string }[]): { problem: string | null } {
  if (!files.length) return { problem: null };
  const ext = (n: string) => n.toLowerCase().split('.').pop() ?? '';
  const xlsx = files.filter((f) => ext(f.name) === 'xlsx');
  const csv = files.filter((f) => ext(f.name) === 'csv');
  const other = files.filter((f) => !['xlsx', 'csv'].includes(ext(f.name)));
  if (other.length) return { problem: `Only .xlsx and .csv files can be read: ${other.map((f) => f.name).join(', ')}` };
  if (xlsx.length > 1) return { problem: 'Upload one workbook at a time' };
  if (xlsx.length && csv.length) return { problem: 'Upload either one workbook or CSV files, not both' };
  return { problem: null };
}
