/** Placeholder replaced once the database harness lands: unit tests need nothing. */
export default async function setup() {}
