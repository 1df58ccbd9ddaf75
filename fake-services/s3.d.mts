export function startS3(o: {
  directory: string;
  port: number;
  bucket: string;
  /** a key pair to accept besides s3rver's own S3RVER/S3RVER */
  accessKeyId?: string;
  secretAccessKey?: string;
}): Promise<{ endpoint: string; close: () => Promise<void> }>;
