package com.stagewise.app;

import com.stagewise.cli.StagewiseCommand;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;

/**
 * Starts the desktop app when given no arguments or only its own ({@code --demo}, {@code --db
 * FILE}), else the command line.
 */
public final class Main {
  private Main() {}

  /** The program's entry point. */
  public static void main(String[] args) {
    if (AppOptions.isDesktop(args)) {
      DesktopLauncher.open(args);
      return;
    }
    PrintWriter out = new PrintWriter(System.out, true, StandardCharsets.UTF_8);
    PrintWriter err = new PrintWriter(System.err, true, StandardCharsets.UTF_8);
    System.exit(StagewiseCommand.execute(args, out, err));
  }
}
