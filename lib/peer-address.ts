import dc from "node:diagnostics_channel";
import type { IncomingMessage } from "node:http";
import type { Socket } from "node:net";
import { PEER_HEADER } from "./client-ip";

const g = globalThis as unknown as { __lwPeerAddress?: boolean };

/**
 * Records each request's connection address in PEER_HEADER (lib/client-ip.ts) before Next sees the
 * request: Node publishes every incoming request on this channel just before the server's 'request'
 * event. A value a client sent under that name is overwritten. Called once from instrumentation.ts.
 */
export function recordPeerAddresses() {
  if (g.__lwPeerAddress) return;
  g.__lwPeerAddress = true;
  dc.subscribe("http.server.request.start", (message) => {
    const { request, socket } = message as { request: IncomingMessage; socket: Socket };
    request.headers[PEER_HEADER] = socket?.remoteAddress ?? "";
  });
}
