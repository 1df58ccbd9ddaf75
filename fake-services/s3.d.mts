export function startS3(o: {
  directory: string;
  port: number;
  bucket: string;
}): Promise<{ endpoint: string; close: () => Promise<void> }>;
