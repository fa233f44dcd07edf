export interface MaildevHandle {
  pid: number | undefined;
  smtpPort: number;
  webPort: number;
  smtpUrl: string;
  webUrl: string;
  apiUrl: string;
  messages(): Promise<unknown[]>;
  clear(): Promise<void>;
  stop(): Promise<void>;
}
export function start(opts?: {
  smtpPort?: number;
  webPort?: number;
  dir?: string;
  log?: (line: string) => void;
  timeoutMs?: number;
}): Promise<MaildevHandle>;
