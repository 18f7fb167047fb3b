package org.cardwright.cli;

import picocli.CommandLine;

/** For tests in other packages: the command line with every subcommand, as {@code --help} builds it. */
public final class MainAccess {
    private MainAccess() {
    }

    public static CommandLine commandLine() {
        return Main.commandLine("--help");
    }
}
