package com.stagewise.cli.history;

import com.stagewise.cli.ExitCode;
import com.stagewise.history.postgres.ServerCheck;
import java.io.PrintWriter;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code history server-check}: what is wrong with this bench's connection to the server. */
@Command(
    name = "server-check",
    mixinStandardHelpOptions = true,
    description =
        "Say in plain words whether this bench can sync with the shop server, and what is wrong if"
            + " not (exit 1 then). Changes nothing.")
final class ServerCheckCommand implements Callable<Integer> {
  @Mixin ServerOption server;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    ServerCheck.Report report = ServerCheck.check(server.require(), System.getenv());
    report.lines().forEach(out::println);
    out.println(
        report.ok() ? "This bench can sync with the server." : "This bench cannot sync yet.");
    out.flush();
    return report.ok() ? ExitCode.OK : ExitCode.INTERNAL_ERROR;
  }
}
