// Integration and e2e tests talk to the server with a fresh connection per request. With keep-alive,
// a test that keeps the event loop busy for longer than the server's idle timeout (parsing a PDF on a
// loaded machine) sends its next request on a socket the server has just closed ("other side
// closed"): a failure of the test's own client, not of the product.
import { Agent, setGlobalDispatcher } from 'undici'

setGlobalDispatcher(new Agent({ pipelining: 0 }))
