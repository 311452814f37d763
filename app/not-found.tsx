import { MissingRecord } from '@/components/shell/MissingRecord';

/** Outside every area (an unknown address): the page has no staff frame, so it brings its own main. */
export default async function NotFound() {
  return <main id="main">{await MissingRecord({})}</main>;
}
