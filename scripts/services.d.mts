export function startLocalServices(env: Record<string, string | undefined>): Promise<{ env: Record<string, string>; summary: string; stop(): Promise<void> | void }>;
