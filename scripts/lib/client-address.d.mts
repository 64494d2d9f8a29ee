import type { IncomingMessage } from 'node:http';

export type ProxyTrust = (address: string, hop: number) => boolean;
export function compileTrustedProxies(setting: string | undefined): ProxyTrust;
export function clientAddressOf(req: IncomingMessage, trust: ProxyTrust): string;
export function makeForwardingHonest(req: IncomingMessage, trust: ProxyTrust): void;
