/** The cautions shown where stands and sits are planned: tree-stand falls and the state's hunting rules. */
import { CAUTIONS, DEFERENCE } from './cautions';

export interface HuntingCaution {
  id: 'tree-stand' | 'hunting-rules';
  title: string;
  text: string;
}

/** Tree stands (full-body harness from the ground up) and state rules on hours, methods, baiting and disease sampling. */
export const HUNTING_CAUTIONS: readonly HuntingCaution[] = [
  { id: 'tree-stand', title: CAUTIONS['tree-stand'].title, text: CAUTIONS['tree-stand'].text },
  {
    id: 'hunting-rules',
    title: 'State hunting rules',
    text:
      'Legal hunting hours, legal methods, tagging, baiting and feeding, and chronic wasting disease sampling vary by state and county; the hours this page uses are a planning guide, not the legal hours. Follow your state wildlife agency’s current rules. ' +
      DEFERENCE,
  },
];
