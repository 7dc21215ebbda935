import { useSessionCheck } from '../hooks/useSessionCheck';

/**
 * The server's check of the signed-in user (`useSessionCheck`), in a component of its own that
 * draws nothing: the answer arriving renders this alone. In the tab shell's own component it
 * rendered the whole shell and Today again, in a long task of its own just after the start.
 */
export function SessionCheck() {
  useSessionCheck();
  return null;
}
