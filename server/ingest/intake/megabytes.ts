/** A size in megabytes for messages: "0.1 MB", "2.5 MB", "512 MB". */
export function megabytes(bytes: number): string {
  const value = bytes / 1_000_000;
  return `${value < 10 ? Number(value.toFixed(1)) : Math.round(value)} MB`;
}
