import type { Server } from 'node:http';

/** Whether the API is stopping: `/api/ready` then answers 503, so a load balancer sends no more. */
export interface Lifecycle {
  draining: boolean;
}

/**
 * Stops taking connections and lets the requests in flight finish, for at most `seconds`; then
 * closes the connections left (an upload cut off there leaves nothing behind, as any broken-off
 * upload). Keep-alive connections close as soon as they are idle (looked for every 100 ms; Node
 * closes only those idle at the start). Resolves once the server is closed.
 */
export function drain(server: Server, lifecycle: Lifecycle, seconds: number): Promise<void> {
  lifecycle.draining = true;
  return new Promise((resolve) => {
    const idle = setInterval(() => server.closeIdleConnections(), 100);
    const deadline = setTimeout(() => server.closeAllConnections(), seconds * 1000);
    server.close(() => {
      clearInterval(idle);
      clearTimeout(deadline);
      resolve();
    });
  });
}
