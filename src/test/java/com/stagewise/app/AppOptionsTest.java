package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class AppOptionsTest {
  private static final String HOME = "/home/tech";

  @Test
  void folder_noOptions_isTheUsersDataFolder() {
    // DESIGN.md: the default lives in $XDG_DATA_HOME/stagewise, else ~/.local/share/stagewise.
    DataFolder folder = AppOptions.parse(List.of()).folder(Map.of(), HOME);
    assertThat(folder.database())
        .isEqualTo(Path.of(HOME, ".local", "share", "stagewise", "stagewise.db"));
    assertThat(folder.settings())
        .isEqualTo(Path.of(HOME, ".local", "share", "stagewise", "settings.properties"));
  }

  @Test
  void folder_demo_usesItsOwnDatabaseBesideTheRealOne() {
    DataFolder folder =
        AppOptions.parse(List.of("--demo")).folder(Map.of("XDG_DATA_HOME", "/data"), HOME);
    assertThat(folder.database())
        .isEqualTo(Path.of("/data", "stagewise", "demo", "stagewise-demo.db"));
  }

  @Test
  void folder_environmentDatabase_winsOverDemo() {
    DataFolder folder =
        AppOptions.parse(List.of("--demo"))
            .folder(Map.of("STAGEWISE_DB", "/shop/history.db"), HOME);
    assertThat(folder.database()).isEqualTo(Path.of("/shop/history.db"));
  }

  @Test
  void folder_dbOption_winsOverEverything() {
    DataFolder folder =
        AppOptions.parse(List.of("--db", "/tmp/x.db", "--demo"))
            .folder(Map.of("STAGEWISE_DB", "/shop/history.db"), HOME);
    assertThat(folder.database()).isEqualTo(Path.of("/tmp/x.db"));
    assertThat(folder.openCases()).isEqualTo(Path.of("/tmp/x.db.open-cases"));
  }

  @Test
  void folder_relativeXdgDataHome_isIgnored() {
    // The XDG base directory specification: a relative path is invalid and must be ignored.
    DataFolder folder = AppOptions.parse(List.of()).folder(Map.of("XDG_DATA_HOME", "data"), HOME);
    assertThat(folder.data()).isEqualTo(Path.of(HOME, ".local", "share", "stagewise"));
  }

  @Test
  void isDesktop_commandLineWords_goToTheCommandLine() {
    assertThat(AppOptions.isDesktop(new String[] {})).isTrue();
    assertThat(AppOptions.isDesktop(new String[] {"--demo"})).isTrue();
    assertThat(AppOptions.isDesktop(new String[] {"--db=/tmp/a.db"})).isTrue();
    assertThat(AppOptions.isDesktop(new String[] {"solve", "--stage", "s.json"})).isFalse();
    assertThat(AppOptions.isDesktop(new String[] {"--db"})).isFalse();
  }

  @Test
  void parse_unknownOption_namesIt() {
    assertThatThrownBy(() -> AppOptions.parse(List.of("--fast")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("--fast");
  }

  @Test
  void parse_aStageSheetFile_isOpenedByTheApp() {
    // A file manager starts the app with the file's path as its one argument.
    AppOptions options = AppOptions.parse(List.of("/media/usb/line-driver.stage.json"));
    assertThat(options.sheet()).isEqualTo(Path.of("/media/usb/line-driver.stage.json"));
    assertThat(AppOptions.isDesktop(new String[] {"--demo", "a.stage.json"})).isTrue();
    assertThat(AppOptions.isDesktop(new String[] {"a.stage.json", "b.stage.json"})).isFalse();
    assertThat(AppOptions.isDesktop(new String[] {"notes.txt"})).isFalse();
  }
}
