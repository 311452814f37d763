import { CONFIDENCE_CHOICES, type AttributeView } from '@/lib/taster';

/** How a rated answer reads back to the taster on the review screen. */
export function ratedAnswerText(attribute: AttributeView, value: number | undefined): string {
  if (value === undefined) return 'Not answered yet';
  if (attribute.scale.kind === 'category') {
    return attribute.scale.points.find((p) => p.value === value)?.label ?? String(value);
  }
  return `${value} of ${attribute.scale.max}`;
}

export function confidenceText(value: number | undefined): string {
  return CONFIDENCE_CHOICES.find((c) => c.value === value)?.label ?? 'Not given';
}
