export function nodeFlagsForCores(setting: string | undefined): string[];
export function missingNodeFlags(setting: string | undefined, execArgv?: readonly string[]): string[];
