import { useContext } from 'react';
import { ApiProblem } from '@/lib/api';
import { useConfirmCalculation } from '../api/confirm-calculation';
import type { CalculationId } from '../calculations';
import { useDebouncedValue } from '../hooks/use-debounced-value';
import { resultDifferences } from '../utils/compare';
import { VisibleCalculationContext } from './playground-scene';

interface ApiConfirmationProps {
  calculation: CalculationId;
  /** The input the preview accepted; undefined while the form is invalid. */
  input: unknown;
  preview: unknown;
}

function describeFailure(error: unknown): string {
  if (error instanceof ApiProblem) {
    if (error.unreachable || (error.status >= 502 && error.status <= 504))
      return 'API unreachable: showing the in-browser result only';
    if (error.status === 401 || error.status === 403)
      return 'Sign in or use an API key to confirm with the API';
    if (error.status === 404) return 'This calculation is not on the API yet';
    return `API said: ${error.message}`;
  }
  return 'API check failed';
}

/** Sends the same input to the API once typing settles and says whether it agrees. */
export function ApiConfirmation({ calculation, input, preview }: ApiConfirmationProps) {
  const settled = useDebouncedValue(input, 600);
  const inputKey = JSON.stringify(input);
  const isSettled = JSON.stringify(settled) === inputKey;
  // A tab out of sight keeps its inputs but does not call the API until it is shown.
  const visible = useContext(VisibleCalculationContext);
  const onScreen = visible === null || visible === calculation;
  const query = useConfirmCalculation(calculation, settled, isSettled && onScreen);

  let state: 'waiting' | 'agrees' | 'differs' | 'failed' = 'waiting';
  let text = 'Checking with the API…';
  if (!isSettled || input === undefined) {
    text = input === undefined ? 'Fix the inputs to check with the API' : 'Checking with the API…';
  } else if (query.isError) {
    state = 'failed';
    text = describeFailure(query.error);
  } else if (query.isSuccess) {
    const differences = resultDifferences(preview, query.data);
    state = differences.length === 0 ? 'agrees' : 'differs';
    text =
      state === 'agrees'
        ? 'The API agrees with this result'
        : `The API answered differently (${differences.slice(0, 3).join(', ')})`;
  }

  const tone =
    state === 'agrees' ? 'text-ok' : state === 'differs' ? 'text-caution' : 'text-ink-muted';
  return (
    <p role="status" data-confirmation={state} className={`text-small ${tone}`}>
      {text}
    </p>
  );
}
