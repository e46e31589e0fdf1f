export declare const ROOT: string;
export declare const APP_PG_PORT: number;
export declare const TEST_PG_PORT: number;
export declare const PG_ROLE: string;
export declare const PASSWORD_FILE: string;
export declare function pgPassword(): string;
export declare function localDbUrl(db: string, cluster?: "app" | "test"): string;
