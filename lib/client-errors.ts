import dc from "node:diagnostics_channel";
import { Server } from "node:http";
import type { Socket } from "node:net";

const g = globalThis as unknown as { __lwClientErrors?: boolean };

/** What Node's HTTP parser refuses before Next sees the request, answered in the API's one error shape. */
function answer(err: NodeJS.ErrnoException): { status: number; code: string; message: string } {
  if (err.code === "HPE_HEADER_OVERFLOW") return { status: 431, code: "headers_too_large", message: "The request's headers are too large." };
  if (err.code === "ERR_HTTP_REQUEST_TIMEOUT") return { status: 408, code: "request_timeout", message: "The request took too long to arrive." };
  return { status: 400, code: "invalid_input", message: "The request could not be read: its first line or a header (a cookie, say) holds characters HTTP does not allow." };
}

function onClientError(err: NodeJS.ErrnoException, socket: Socket & { _httpMessage?: unknown }) {
  // A client that went away, or an answer already under way: nothing can be said any more.
  if (err.code === "ECONNRESET" || !socket.writable || socket._httpMessage) return void socket.destroy();
  const a = answer(err);
  const body = JSON.stringify({ error: { code: a.code, message: a.message } });
  socket.end(
    `HTTP/1.1 ${a.status} ${a.status === 400 ? "Bad Request" : a.status === 408 ? "Request Timeout" : "Request Header Fields Too Large"}\r\n` +
      "Content-Type: application/json\r\nX-Content-Type-Options: nosniff\r\nCache-Control: no-store\r\nConnection: close\r\n" +
      `Content-Length: ${Buffer.byteLength(body)}\r\n\r\n${body}`,
  );
}

/**
 * A request Node's HTTP parser refuses (a control character in a cookie, a header too large) never
 * reaches Next; Node would answer a bare 400 with no body. This gives the app's HTTP server a
 * 'clientError' handler that answers in the one JSON error shape (lib/errors.ts) instead. The server is
 * found on its first connection (Node publishes each on this channel before reading from it).
 * Called once from instrumentation.ts.
 */
export function answerClientErrorsAsJson() {
  if (g.__lwClientErrors) return;
  g.__lwClientErrors = true;
  const done = new WeakSet<Server>();
  dc.subscribe("net.server.socket", (message) => {
    const server = (message as { socket: Socket & { server?: unknown } }).socket?.server;
    if (!(server instanceof Server) || done.has(server)) return;
    done.add(server);
    if (server.listenerCount("clientError") === 0) server.on("clientError", onClientError);
  });
}
