import { MissingRecord } from '@/components/shell/MissingRecord';

export default function NotFound() {
  return <MissingRecord kind="product family" />;
}
