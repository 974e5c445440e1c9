import type { Config } from '../../config';

/** The origin for links in mail: `PUBLIC_ORIGIN`, else where this request came in. */
export function publicOrigin(
  config: Config,
  req: { protocol: string; get(name: string): string | undefined },
): string {
  return (
    config.PUBLIC_ORIGIN?.replace(/\/+$/, '') ??
    `${req.protocol}://${req.get('host') ?? 'localhost'}`
  );
}
