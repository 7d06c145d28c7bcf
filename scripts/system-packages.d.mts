/** Declarations of scripts/system-packages.mjs for the tests. */
export interface SystemPackage { command: string; pkg: string; neededBy: string }
export const REQUIRED: SystemPackage[];
export function findCommand(command: string, path?: string): string | null;
export function missingPackages(path?: string): SystemPackage[];
export function missingLine(missing: SystemPackage[]): string;
