package com.stagewise.cli.history;

import com.stagewise.cli.ExitCode;
import com.stagewise.history.postgres.ServerCheck;
import java.io.PrintWriter;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** {@code history server-init}: the shop's schema on the server, and each bench role's rights. */
@Command(
    name = "server-init",
    mixinStandardHelpOptions = true,
    description =
        "Create (or update) the shop's schema on the shop server; run it as the database's owner."
            + " --grant gives a bench's role exactly the rights a bench needs.")
final class ServerInitCommand implements Callable<Integer> {
  @Mixin ServerOption server;

  @Option(names = "--grant", paramLabel = "ROLE", description = "A bench role to grant rights to.")
  List<String> roles = new ArrayList<>();

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    for (String line :
        ServerCheck.initialise(server.require(), Clock.systemUTC(), System.getenv(), roles)) {
      out.println(line);
    }
    out.flush();
    return ExitCode.OK;
  }
}
