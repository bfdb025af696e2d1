import { memberCheckInputSchema, type MemberCheckInput, type MemberCheckInputRaw } from '../schemas.ts';
import type { CheckResult } from './types.ts';
import { checkAs4100 } from './as4100.ts';
import { checkAisc360 } from './aisc360.ts';
import { checkEn1993 } from './en1993.ts';

/**
 * Run the member check of the input's standard. Input already validated (see
 * memberCheckInputSchema); forces N, tension positive.
 */
export function checkMember(input: MemberCheckInput): CheckResult {
  switch (input.standard) {
    case 'as4100':
      return checkAs4100(input);
    case 'aisc360':
      return checkAisc360(input);
    case 'en1993':
      return checkEn1993(input);
  }
}

/** Validate raw input (throws the zod error) and run the check. */
export function checkMemberRaw(raw: MemberCheckInputRaw): CheckResult {
  return checkMember(memberCheckInputSchema.parse(raw));
}
