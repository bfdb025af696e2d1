import { STANDARD_LABELS, type StandardId } from '@shared/api';

export function standardName(id: StandardId): string {
  return STANDARD_LABELS[id] ?? id;
}
