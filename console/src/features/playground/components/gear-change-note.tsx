import { Button } from '@/components/ui/button';
import type { Followed } from './gear-changes';

interface GearChangeNoteProps<T extends { name: string }> {
  followed: Followed<T> | undefined;
  /** "light", "modifier", "gel kit": what the picker picks. */
  thing: string;
  /** What keeping the picked values means here, as a sentence. */
  keeping: string;
  /** Fill the fields anew from the item as it is now; left out when it has nothing to fill. */
  onRefill?: () => void;
  refillLabel?: string;
  /** Forget the pick, keeping what the fields hold; left out where the pick holds the values.
   * Offered as "Keep my values" for a changed item and "Dismiss" for a deleted one. */
  onKeep?: () => void;
}

/**
 * Beside a "from your gear" picker: the picked item was changed or deleted in the studio's gear
 * since it was picked (in another tab, or by someone else), in plain words, with the choices.
 */
export function GearChangeNote<T extends { name: string }>({
  followed,
  thing,
  keeping,
  onRefill,
  refillLabel = 'Use the new values',
  onKeep,
}: GearChangeNoteProps<T>) {
  if (!followed || followed.state === 'current') return null;
  const tone =
    'col-span-2 rounded-control border-l-4 border-caution bg-raised px-3 py-2 text-small';
  if (followed.state === 'deleted')
    return (
      <div role="status" className={tone} data-testid="gear-pick-deleted">
        <p>
          The {thing} {followed.was.name} was deleted from your studio’s gear after you picked it.{' '}
          {keeping}
        </p>
        {onKeep ? (
          <Button variant="quiet" size="inline" className="mt-1 underline" onClick={onKeep}>
            Dismiss
          </Button>
        ) : null}
      </div>
    );
  return (
    <div role="status" className={tone} data-testid="gear-pick-changed">
      <p>
        The {thing} {followed.now.name} was changed in your studio’s gear after you picked it:{' '}
        {followed.what.join(', ')}. {keeping}
      </p>
      <div className="mt-1 flex flex-wrap gap-3">
        {onRefill ? (
          <Button variant="quiet" size="inline" className="underline" onClick={onRefill}>
            {refillLabel}
          </Button>
        ) : null}
        {onKeep ? (
          <Button variant="quiet" size="inline" className="underline" onClick={onKeep}>
            Keep my values
          </Button>
        ) : null}
      </div>
    </div>
  );
}
