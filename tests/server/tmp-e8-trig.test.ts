import { testApp } from '../support/test-app';
jest.setTimeout(60000);
it('triggers', async () => {
  const t = await testApp();
  console.log(JSON.stringify(await t.db.raw("select name from sqlite_master where type='trigger'")));
  console.log(JSON.stringify(await t.db.raw('pragma recursive_triggers')), JSON.stringify(await t.db.raw('select sqlite_version() as v')));
  await t.cleanup();
});
