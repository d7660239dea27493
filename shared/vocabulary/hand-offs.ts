// The kinds of hand-off the desk writes a person, in the words the list of hand-offs shows.
export const HAND_OFF_KINDS: Record<string, string> = {
  submitted: 'Submitted for review',
  assigned: 'Assigned to you',
  decided: 'Decision recorded, to issue',
  returned: 'Stamped return issued',
  answered: 'Findings answered',
  resubmitted: 'Resubmitted',
  reminder: 'Reminder',
  review_due: 'Review due',
};

export const handOffKind = (event: string) => HAND_OFF_KINDS[event] ?? 'Hand-off';
