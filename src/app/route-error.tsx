// What a person sees when a page fails to render or its data cannot be loaded.
import { Link, useRouteError } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { PlainLayout } from '@/components/layouts/plain-layout';
import { buttonClasses } from '@/components/ui/button';

export function RouteError() {
  const error = useRouteError();
  const message = isApiError(error)
    ? error.message
    : 'Something went wrong while showing this page. Reload it; if it happens again, tell the desk administrator what you were doing.';
  return (
    <PlainLayout>
      <div
        role="alert"
        className="w-full max-w-[560px] border border-failed-edge border-l-4 bg-sheet px-7 py-8"
      >
        <h1 className="text-[22px] font-black">This page could not be shown</h1>
        <p className="mt-2 text-sm text-ink-soft">{message}</p>
        <div className="mt-5 flex gap-2">
          <button type="button" className={buttonClasses('primary')} onClick={() => window.location.reload()}>
            Reload
          </button>
          <Link to="/" className={buttonClasses('secondary')}>
            Go to your desk
          </Link>
        </div>
      </div>
    </PlainLayout>
  );
}
