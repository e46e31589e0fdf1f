export declare const SERVER_NODE_FLAGS: string[];
export declare function nextStartArgs(host: string, port: number | string, extraNodeFlags?: string[]): string[];
