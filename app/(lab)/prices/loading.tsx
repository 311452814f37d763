import { PageSkeleton } from '@/components/shell/PageSkeleton';

export default function Loading() {
  return <PageSkeleton shape="list" />;
}
