export function startSmtp(o: {
  directory: string;
  port: number;
}): Promise<{ port: number; close: () => Promise<void> }>;
