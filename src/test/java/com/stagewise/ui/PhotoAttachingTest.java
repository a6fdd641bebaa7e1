package com.stagewise.ui;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.TestPictures;
import com.stagewise.ui.closeout.CloseOutViewModel;
import com.stagewise.ui.history.HistoryViewModel;
import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A photo of the board attached from the close-out and the history screens: the file the chooser
 * gives is stored with the case; a file that is not a picture, or one over 20 MB, is refused in
 * plain words naming it, and the case is left as it was. Pictures from the JDK's own writers.
 */
class PhotoAttachingTest {
  @TempDir Path temp;
  private TestBench t;
  private String caseId;
  private final List<String> asked = new ArrayList<>();

  @BeforeEach
  void setUp() {
    t = TestBench.open(temp);
    var board = t.store.units().boardModel("Test amp board", "");
    var unit = t.store.units().add("TA-7/2", board.id(), "");
    t.bench.showUnit(unit, board);
    t.bench.startCase(t.store.cases().open(unit.id(), "Output pinned"));
    caseId = t.bench.openCaseProperty().get().id();
  }

  @AfterEach
  void tearDown() {
    t.close();
  }

  private void choose(Path file) {
    t.bench.setFiles(
        new FilePicker() {
          @Override
          public Optional<Path> saveAs(String title, String name, String kind, String pattern) {
            return Optional.empty();
          }

          @Override
          public Optional<Path> open(String title, String kind, List<String> patterns) {
            asked.add(title + " | " + kind + " | " + patterns);
            return Optional.ofNullable(file);
          }
        });
  }

  @Test
  void closeOut_attachesTheChosenPhoto_andListsIt() throws IOException {
    Path photo = temp.resolve("board top.jpg");
    Files.write(photo, TestPictures.jpeg(400, 300));
    choose(photo);
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);

    closeOut.attachPhoto();

    assertThat(asked).hasSize(1);
    assertThat(asked.get(0)).contains("Attach a photo of the board", "*.jpg", "*.png");
    assertThat(closeOut.photos()).hasSize(1);
    assertThat(closeOut.photos().get(0)).startsWith("board top.jpg — 400 × 300, ");
    var stored = t.store.cases().caseFile(caseId).orElseThrow().photos();
    assertThat(stored).hasSize(1);
    assertThat(t.store.cases().photo(stored.get(0).id()).orElseThrow().image())
        .isEqualTo(Files.readAllBytes(photo));
    assertThat(t.problems).isEmpty();
  }

  @Test
  void aTextFile_isRefusedNamingIt_andNothingIsStored() throws IOException {
    Path notes = temp.resolve("readings.txt");
    Files.writeString(notes, "U1 pin 1 read 13.4 V", StandardCharsets.UTF_8);
    choose(notes);
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);

    closeOut.attachPhoto();

    assertThat(t.problems).containsExactly("Could not attach the photo");
    assertThat(t.problemTexts.get(0)).contains("readings.txt is not a photo", "PNG or JPEG");
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().photos()).isEmpty();
    assertThat(closeOut.photos()).isEmpty();
  }

  @Test
  void aFileOver20Megabytes_isRefusedSayingTheLimit() throws IOException {
    Path big = temp.resolve("huge.png");
    Files.write(big, TestPictures.png(8, 8));
    try (RandomAccessFile f = new RandomAccessFile(big.toFile(), "rw")) {
      f.setLength(21L * 1024 * 1024);
    }
    choose(big);
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);

    closeOut.attachPhoto();

    assertThat(t.problems).containsExactly("Could not attach the photo");
    assertThat(t.problemTexts.get(0)).contains("huge.png is 21.0 MB", "at most 20.0 MB");
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().photos()).isEmpty();
  }

  @Test
  void aCancelledChooser_attachesNothing() {
    choose(null);
    CloseOutViewModel closeOut = new CloseOutViewModel(t.bench);
    closeOut.attachPhoto();
    assertThat(asked).hasSize(1);
    assertThat(t.problems).isEmpty();
    assertThat(t.store.cases().caseFile(caseId).orElseThrow().photos()).isEmpty();
  }

  @Test
  void historyScreen_attachesToTheShownCase_showsItsThumbnail_andEnlargesIt() throws IOException {
    Path photo = temp.resolve("under U3.png");
    byte[] png = TestPictures.png(640, 480);
    Files.write(photo, png);
    choose(photo);
    HistoryViewModel history = new HistoryViewModel(t.bench);
    history.show(caseId);
    assertThat(history.photos()).isEmpty();

    history.attachPhoto();

    assertThat(history.photos()).hasSize(1);
    HistoryViewModel.ShownPhoto shown = history.photos().get(0);
    assertThat(shown.image()).isEqualTo(png);
    assertThat(shown.caption()).startsWith("under U3.png — 640 × 480, ");
    history.enlarge(shown);
    assertThat(history.enlargedProperty().get()).isSameAs(shown);
    history.closeEnlarged();
    assertThat(history.enlargedProperty().get()).isNull();
  }
}
