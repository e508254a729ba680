/**
 * The parts of express 4 and compression 1 that scripts/serve.ts uses. The packages ship no types
 * and @types/express / @types/compression are not installed; these declarations follow their
 * documented APIs (and are replaced by those packages once installed: delete this file then).
 * @react-router/express's own declarations import "express" and resolve to this module too.
 */
declare module "express" {
  import type http from "node:http";

  interface Request extends http.IncomingMessage {
    app: Application;
    /** The client's address, after the `trust proxy` setting has been applied to X-Forwarded-For. */
    ip: string | undefined;
    ips: string[];
    hostname: string;
    protocol: string;
    originalUrl: string;
    path: string;
    get(name: string): string | undefined;
  }

  interface Response extends http.ServerResponse {
    status(code: number): this;
    append(name: string, value: string | string[]): this;
    set(name: string, value: string | string[]): this;
    json(body: unknown): this;
  }

  type NextFunction = (err?: unknown) => void;
  type RequestHandler = (req: Request, res: Response, next: NextFunction) => unknown;
  type ErrorRequestHandler = (err: unknown, req: Request, res: Response, next: NextFunction) => unknown;

  interface Application extends http.RequestListener {
    (req: http.IncomingMessage, res: http.ServerResponse): void;
    use(...handlers: Array<RequestHandler | ErrorRequestHandler | Application>): this;
    use(path: string, ...handlers: Array<RequestHandler | ErrorRequestHandler | Application>): this;
    set(setting: string, value: unknown): this;
    get(setting: string): unknown;
    enabled(setting: string): boolean;
    disable(setting: string): this;
  }

  interface StaticOptions {
    /** Cache-Control max-age in milliseconds or as a string such as "1y". */
    maxAge?: number | string;
    immutable?: boolean;
    index?: false | string | string[];
    redirect?: boolean;
    fallthrough?: boolean;
    etag?: boolean;
    lastModified?: boolean;
    dotfiles?: "allow" | "deny" | "ignore";
    setHeaders?: (res: http.ServerResponse, path: string) => void;
  }

  interface Express {
    (): Application;
    static(root: string, options?: StaticOptions): RequestHandler;
  }

  const express: Express;
  export default express;
  export type { Application, ErrorRequestHandler, NextFunction, Request, RequestHandler, Response, StaticOptions };
}

declare module "compression" {
  import type http from "node:http";
  import type { RequestHandler } from "express";

  interface CompressionOptions {
    /** Bytes below which a response is sent as it is (default 1 KB). */
    threshold?: number | string;
    level?: number;
    filter?: (req: http.IncomingMessage, res: http.ServerResponse) => boolean;
  }
  interface Compression {
    (options?: CompressionOptions): RequestHandler;
    filter(req: http.IncomingMessage, res: http.ServerResponse): boolean;
  }
  const compression: Compression;
  export default compression;
}
