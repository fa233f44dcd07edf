import { useEffect, useRef } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { paths } from '@/config/paths';
import { problemMessage } from '@/lib/form-errors';
import { useConfirmEmailChange } from '../api/password-reset';

/** Opened from the e-mailed link: confirms the new address once. */
export function ConfirmEmail() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmEmailChange();
  const sent = useRef(false);
  const { mutate } = confirm;

  useEffect(() => {
    if (!token || sent.current) return;
    sent.current = true;
    mutate(token);
  }, [token, mutate]);

  if (!token) return <Notice tone="fault">This link has no token.</Notice>;
  if (confirm.isError) return <Notice tone="fault">{problemMessage(confirm.error)}</Notice>;
  if (confirm.isSuccess) {
    return (
      <Notice tone="ok">
        Your e-mail address is changed. <Link to={paths.overview}>Open the console</Link>
      </Notice>
    );
  }
  return <PageLoading />;
}
