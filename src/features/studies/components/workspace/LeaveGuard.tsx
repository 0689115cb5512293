import { useEffect, useRef } from 'react';
import { useBlocker } from 'react-router';
import { Button } from '#src/components/Button';
import { Dialog } from '#src/components/Dialog';

/**
 * Asks before leaving a study with unsaved changes: inside the app with our own dialog, and for
 * a reload, a closed tab or another site with the browser's own question.
 * `allowRef` lets the page leave on purpose (after keeping a copy) without asking.
 */
export function LeaveGuard({ dirty, allowRef }: { dirty: boolean; allowRef: React.RefObject<boolean> }) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && !allowRef.current && currentLocation.pathname !== nextLocation.pathname);
  const stayRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (allowRef.current) return;
      event.preventDefault();
      // Older browsers need a value to show their question.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [dirty, allowRef]);

  return (
    <Dialog
      open={blocker.state === 'blocked'}
      title="Leave without saving?"
      description="This study has changes that are not saved. Leaving drops them."
      onClose={() => blocker.reset?.()}
      initialFocusRef={stayRef}
    >
      <div className="flex flex-wrap justify-end gap-3">
        <Button ref={stayRef} onClick={() => blocker.reset?.()}>
          Stay on this study
        </Button>
        <Button variant="destructive" onClick={() => blocker.proceed?.()}>
          Leave and drop my changes
        </Button>
      </div>
    </Dialog>
  );
}
