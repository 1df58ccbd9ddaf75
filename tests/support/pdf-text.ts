// The text a PDF viewer would extract, through the report module's own pdfjs reader.
import { readPdfPages } from '../../src/server/reports/testing/read-pdf';

export async function extractPdfText(bytes: Buffer): Promise<string> {
  return (await readPdfPages(bytes)).map((p) => p.text).join('\n');
}
