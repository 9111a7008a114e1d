import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { PageLoading } from 'src/components/PageLoading';
import { useMe } from 'src/features/auth/api/get-me';
import { useNextPath, withNext } from './use-next-path';

/**
 * For the pages only a visitor needs (sign in, create an account): `instead` is what shows while
 * the session is asked for (a spinner) or once someone is signed in (on to `?next=`), else null;
 * `goNext` goes there after signing in; `linkTo` links another account page, keeping `next`.
 */
export function useVisitorPage() {
  const me = useMe();
  const navigate = useNavigate();
  const next = useNextPath();
  const [params] = useSearchParams();
  const instead = me.isPending ? <PageLoading /> : me.data ? <Navigate to={next} replace /> : null;
  return {
    instead,
    goNext: () => navigate(next, { replace: true }),
    linkTo: (path: string) => withNext(path, params.get('next')),
  };
}
