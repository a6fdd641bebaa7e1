package com.stagewise.app;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.demo.DemoHistory;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class WorkshopTest {
  @TempDir Path temp;

  private DataFolder folder() {
    return new DataFolder(temp, temp.resolve("stagewise.db"));
  }

  @Test
  void open_demoOnEmptyHistory_fillsTheShopAndTheLibrary() {
    try (Workshop w = Workshop.open(folder(), true, Path.of("data", "stages"))) {
      var mixer = w.store().units().findBoardModel(DemoHistory.MIXER).orElseThrow();
      assertThat(w.store().units().list(mixer.id())).isNotEmpty();
      assertThat(w.boardFlags().isMainsPowered(mixer.id())).isTrue();
      // Every sheet of the demo library joins its board's library.
      int sheets =
          w.store().units().boardModels().stream()
              .mapToInt(m -> w.store().library().sheets(m.id()).size())
              .sum();
      assertThat(sheets).isGreaterThanOrEqualTo(DemoSetup.sheets(Path.of("data", "stages")).size());
    }
  }

  @Test
  void open_demoTwice_neverAddsTheDemoAgain() {
    int units;
    try (Workshop w = Workshop.open(folder(), true, Path.of("data", "stages"))) {
      units = w.store().units().list(null).size();
    }
    try (Workshop w = Workshop.open(folder(), true, Path.of("data", "stages"))) {
      assertThat(w.store().units().list(null)).hasSize(units);
    }
  }

  @Test
  void open_withoutDemo_leavesAnEmptyHistoryEmpty() {
    try (Workshop w = Workshop.open(folder(), false, Path.of("data", "stages"))) {
      assertThat(w.store().isEmpty()).isTrue();
    }
  }

  @Test
  void settings_cautionAcknowledged_isRememberedAcrossStarts() {
    try (Workshop w = Workshop.open(folder(), false, Path.of("data", "stages"))) {
      assertThat(w.settings().cautionAcknowledged()).isFalse();
      w.settings().acknowledgeCaution();
    }
    try (Workshop w = Workshop.open(folder(), false, Path.of("data", "stages"))) {
      assertThat(w.settings().cautionAcknowledged()).isTrue();
    }
  }
}
