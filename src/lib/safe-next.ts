import { paths } from '@/config/paths';

/** Where to go after signing in or up: only same-site paths are followed, anything else goes home. */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\') ? next : paths.home;
}
