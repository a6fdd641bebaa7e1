package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CasePhoto;
import com.stagewise.history.record.HistoryBundle;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.StoredPhoto;
import com.stagewise.history.record.Unit;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

/**
 * The contract of photos of the board ({@link Cases#attachPhoto}, {@link Cases#photo}): what every
 * store keeps of an attached photo, what it refuses, and that photos travel in bundles. The
 * pictures come from the JDK's own PNG and JPEG writers ({@link TestPictures}).
 */
public abstract class PhotosContract extends StoreContract {

  private RepairCase openCase() {
    BoardModel model = store.units().boardModel("MX-8", "Northfield");
    Unit unit = store.units().add("NF-1", model.id(), "");
    return store.cases().open(unit.id(), "hum on the left channel");
  }

  @Test
  void attachPhoto_keepsThePictureExactly_withItsNameTimeAndWho() {
    RepairCase c = openCase();
    byte[] png = TestPictures.png(64, 48);
    CasePhoto attached =
        store.cases().attachPhoto(c.id(), new Cases.PhotoDraft("board top.png", png, "Ann"));

    assertThat(attached.fileName()).isEqualTo("board top.png");
    assertThat(attached.mediaType()).isEqualTo("image/png");
    // The size in pixels as the JDK's writer made it.
    assertThat(attached.width()).isEqualTo(64);
    assertThat(attached.height()).isEqualTo(48);
    assertThat(attached.bytes()).isEqualTo(png.length);
    assertThat(attached.attachedBy()).isEqualTo("Ann");
    assertThat(attached.attachedAt())
        .isEqualTo(clock.instant().truncatedTo(java.time.temporal.ChronoUnit.MILLIS));
    assertThat(store.cases().caseFile(c.id()).orElseThrow().photos()).containsExactly(attached);
    StoredPhoto stored = store.cases().photo(attached.id()).orElseThrow();
    assertThat(stored.photo()).isEqualTo(attached);
    assertThat(stored.image()).isEqualTo(png);
  }

  @Test
  void attachPhoto_aJpeg_andASecondPhoto_areListedInTheOrderAttached() {
    RepairCase c = openCase();
    CasePhoto first =
        store
            .cases()
            .attachPhoto(c.id(), new Cases.PhotoDraft("a.jpg", TestPictures.jpeg(40, 30), ""));
    clock.advanceMillis(1_000);
    CasePhoto second =
        store
            .cases()
            .attachPhoto(c.id(), new Cases.PhotoDraft("b.png", TestPictures.png(10, 20), "Ben"));
    assertThat(first.mediaType()).isEqualTo("image/jpeg");
    assertThat(first.width()).isEqualTo(40);
    assertThat(first.height()).isEqualTo(30);
    assertThat(store.cases().caseFile(c.id()).orElseThrow().photos())
        .containsExactly(first, second);
  }

  @Test
  void attachPhoto_notAPicture_isRefused_andNothingIsStored() {
    RepairCase c = openCase();
    byte[] text = "R2 looked burnt".getBytes(StandardCharsets.UTF_8);
    assertThatThrownBy(
            () -> store.cases().attachPhoto(c.id(), new Cases.PhotoDraft("notes.txt", text, "")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("PNG or JPEG");
    assertThat(store.cases().caseFile(c.id()).orElseThrow().photos()).isEmpty();
  }

  @Test
  void attachPhoto_over20Megabytes_isRefusedSayingTheLimit() {
    RepairCase c = openCase();
    byte[] png = TestPictures.png(8, 8);
    byte[] huge = Arrays.copyOf(png, (int) Checks.MAX_PHOTO_BYTES + 1);
    assertThatThrownBy(
            () -> store.cases().attachPhoto(c.id(), new Cases.PhotoDraft("huge.png", huge, "")))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("20.0 MB");
    assertThat(store.cases().caseFile(c.id()).orElseThrow().photos()).isEmpty();
  }

  @Test
  void attachPhoto_toAnUnknownCase_isRefused() {
    openCase();
    assertThatThrownBy(
            () ->
                store
                    .cases()
                    .attachPhoto(
                        HistoryStore.newId(),
                        new Cases.PhotoDraft("a.png", TestPictures.png(4, 4), "")))
        .isInstanceOf(InvalidInputException.class);
  }

  @Test
  void photos_travelInBundles_andASecondImportChangesNothing() {
    RepairCase c = openCase();
    byte[] jpeg = TestPictures.jpeg(120, 90);
    CasePhoto attached =
        store.cases().attachPhoto(c.id(), new Cases.PhotoDraft("under U3.jpg", jpeg, "Ann"));
    HistoryBundle bundle = store.transfer().export(new ExportSelection.All(), "test");
    assertThat(bundle.photos()).hasSize(1);
    try (HistoryStore other = openStore(Clock.systemUTC())) {
      ImportReport report = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(report.conflicts()).isEmpty();
      assertThat(other.cases().caseFile(c.id()).orElseThrow().photos()).containsExactly(attached);
      assertThat(other.cases().photo(attached.id()).orElseThrow().image()).isEqualTo(jpeg);
      ImportReport again = other.transfer().importBundle(bundle, "bundle.json");
      assertThat(again.added()).isZero();
      assertThat(again.conflicts()).isEmpty();
    }
  }
}
