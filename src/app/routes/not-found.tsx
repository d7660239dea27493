// Any path the client does not know.
import { Link, useLocation } from 'react-router-dom';
import { PlainLayout } from '@/components/layouts/plain-layout';
import { buttonClasses } from '@/components/ui/button';

export default function NotFoundRoute() {
  const location = useLocation();
  return (
    <PlainLayout>
      <div className="w-full max-w-[560px] border border-rule bg-sheet px-7 py-8">
        <p className="font-mono text-[13px] font-bold text-ink-soft">404</p>
        <h1 className="mt-1 text-[24px] font-black">There is no page here</h1>
        <p className="mt-2 text-sm text-ink-soft">
          Nothing lives at <code className="break-all font-mono text-ink">{location.pathname}</code>. The link
          may be mistyped or out of date.
        </p>
        <Link to="/" className={`${buttonClasses('primary')} mt-5`}>
          Go to your desk
        </Link>
      </div>
    </PlainLayout>
  );
}
