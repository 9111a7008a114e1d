// Prints a TCP port that is free on 127.0.0.1 right now.
import net from 'node:net';
const server = net.createServer();
server.listen(0, '127.0.0.1', () => {
  const { port } = server.address();
  server.close(() => process.stdout.write(String(port)));
});
