// A local S3-compatible store on loopback for uploads (sign-off photos, reference files).
import S3rver from 's3rver';

const args = Object.fromEntries(process.argv.slice(2).map((a) => a.replace(/^--/, '').split('=')));
const port = Number(args.port);
const { directory, bucket } = args;
if (!port || !directory || !bucket) {
  console.error('usage: s3.mjs --port=N --directory=DIR --bucket=NAME');
  process.exit(2);
}

const server = new S3rver({ port, address: '127.0.0.1', directory, silent: true, configureBuckets: [{ name: bucket }] });
await server.run();
console.log(`S3 fake: port ${port}, bucket ${bucket}`);
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.close().then(() => process.exit(0)));
