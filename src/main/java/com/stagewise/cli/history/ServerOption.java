package com.stagewise.cli.history;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.ServerAddress;
import picocli.CommandLine.Option;

/** The {@code --server} option of the commands that talk to the shop server. */
final class ServerOption {
  @Option(
      names = "--server",
      paramLabel = "URL",
      description =
          "The shop server, postgresql://HOST[:PORT]/DATABASE[?schema=NAME] (default:"
              + " $STAGEWISE_SERVER). User and password come from PGUSER and PGPASSWORD or a"
              + " .pgpass file, never from the command line.")
  String server;

  ServerAddress require() {
    return ServerAddress.resolve(server, System.getenv())
        .orElseThrow(
            () ->
                new InvalidInputException(
                    "--server",
                    "server",
                    "no shop server given: name it with --server postgresql://HOST/DATABASE or"
                        + " STAGEWISE_SERVER"));
  }
}
