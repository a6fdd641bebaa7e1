package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.history.record.ActionKind;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.CaseStatus;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;

/** The contract of {@link Cases#search}: what every store finds, and in which order. */
public abstract class SearchContract extends StoreContract {
  private RepairCase hum;
  private RepairCase dead;
  private RepairCase clipping;

  @BeforeEach
  void fill() {
    clock.set(Instant.parse("2026-01-10T09:00:00Z"));
    BoardModel mixer = store.units().boardModel("MX-8 main board", "Northfield Audio");
    BoardModel psu = store.units().boardModel("PSU-30", "Harbour Instruments");
    Unit m1 = store.units().add("NF-8-0001", mixer.id(), "");
    Unit m2 = store.units().add("NF-8-0002", mixer.id(), "");
    Unit p1 = store.units().add("HB30/17\"A\"; drop", psu.id(), "");
    hum = store.cases().open(m1.id(), "Left channel hums at 100 Hz, worse when warm");
    store.cases().addAction(hum.id(), ActionKind.PART_REPLACED, "C12", "100u", "100u", "dried out");
    store.cases().close(hum.id(), Outcome.FIXED, List.of("C12:open"));
    clock.advanceDays(20);
    dead = store.cases().open(m2.id(), "No output on the right channel");
    store.cases().addNote(dead.id(), "Output op-amp runs hot; suspect a shorted feedback resistor");
    store.cases().close(dead.id(), Outcome.FIXED, List.of("U1A:dead", "R2:short"));
    clock.advanceDays(20);
    clipping = store.cases().open(p1.id(), "Output clips at 12 V instead of 15 V; the hum is gone");
  }

  @Test
  void bySerial_exactIgnoringCase() {
    assertThat(ids(SearchQuery.all().withSerial("nf-8-0002"))).containsExactly(dead.id());
    assertThat(ids(SearchQuery.all().withSerial("NF-8"))).isEmpty();
  }

  @Test
  void bySerial_withQuotesAndSemicolons() {
    assertThat(ids(SearchQuery.all().withSerial("HB30/17\"A\"; drop")))
        .containsExactly(clipping.id());
  }

  @Test
  void byBoardModel_newestFirst() {
    assertThat(ids(SearchQuery.all().withBoardModel("mx-8 MAIN board")))
        .containsExactly(dead.id(), hum.id());
  }

  @Test
  void byFaultId() {
    assertThat(ids(SearchQuery.all().withFaultId("R2:short"))).containsExactly(dead.id());
  }

  @Test
  void byPart_findsFaultsAndActions() {
    assertThat(ids(SearchQuery.all().withPart("R2"))).containsExactly(dead.id());
    assertThat(ids(SearchQuery.all().withPart("c12"))).containsExactly(hum.id());
    // U1 finds U1A:dead (the package of the section).
    assertThat(ids(SearchQuery.all().withPart("U1"))).containsExactly(dead.id());
    assertThat(ids(SearchQuery.all().withPart("R20"))).isEmpty();
  }

  @Test
  void byStatusAndDates() {
    assertThat(ids(SearchQuery.all().withStatus(CaseStatus.OPEN))).containsExactly(clipping.id());
    assertThat(
            ids(
                SearchQuery.all()
                    .withOpenedFrom(Instant.parse("2026-01-20T00:00:00Z"))
                    .withOpenedBefore(Instant.parse("2026-02-05T00:00:00Z"))))
        .containsExactly(dead.id());
  }

  @Test
  void fullText_findsSymptomsAndNotes_withSnippet() {
    List<SearchHit> hits = store.cases().search(SearchQuery.all().withText("shorted feedback"));
    assertThat(hits).extracting(SearchHit::caseId).containsExactly(dead.id());
    assertThat(hits.get(0).snippet()).contains("[shorted]").contains("[feedback]");
  }

  @Test
  void fullText_ranksTheBetterMatchFirst() {
    // bm25 (SQLite FTS5 documentation, "The bm25() function"; Robertson and Zaragoza 2009) ranks
    // a text that holds the word more often, relative to its length, above one that mentions it
    // once among many words.
    String unit = store.units().bySerial("NF-8-0001").get(0).id();
    RepairCase passing =
        store
            .cases()
            .open(
                unit,
                "Faint crackle on the aux send, only when the channel fader moves fast, "
                    + "otherwise the unit behaves normally on every output and input we tried today");
    RepairCase strong = store.cases().open(unit, "Crackle, loud crackle on every knob");
    List<SearchHit> hits = store.cases().search(SearchQuery.all().withText("crackle"));
    assertThat(hits).extracting(SearchHit::caseId).containsExactly(strong.id(), passing.id());
    assertThat(hits.get(0).score()).isGreaterThan(hits.get(1).score());
  }

  @Test
  void fullText_prefixAndCombinedWithFilters() {
    assertThat(ids(SearchQuery.all().withText("warm").withBoardModel("PSU-30"))).isEmpty();
    assertThat(ids(SearchQuery.all().withText("clip"))).containsExactly(clipping.id());
  }

  @Test
  void fullText_hostileQuerySyntax_isSearchedNotObeyed() {
    assertThat(ids(SearchQuery.all().withText("\"hum OR body:* NEAR("))).isEmpty();
    assertThat(ids(SearchQuery.all().withText("\" ; ' --"))).isEmpty();
  }

  @Test
  void fullText_ignoresAccents() {
    RepairCase accented =
        store
            .cases()
            .open(store.units().bySerial("NF-8-0001").get(0).id(), "Grésillement au démarrage");
    assertThat(ids(SearchQuery.all().withText("gresillement demarrage")))
        .containsExactly(accented.id());
  }

  @Test
  void fullText_wordsOnlyShortcut_givesTheSameHitsAsTheFullRanking() {
    // Two ways to the same answer: with words only, only the best texts of each index are ranked;
    // a filter that excludes nothing (opened after 1970) forces ranking every match.
    java.util.Random random = new java.util.Random(5);
    String unit = store.units().bySerial("NF-8-0001").get(0).id();
    String[] words = {"relay", "chatter", "noise", "fuse", "warm", "cold", "buzz", "pop"};
    for (int i = 0; i < 60; i++) {
      StringBuilder text = new StringBuilder();
      for (int w = 0; w < 3 + random.nextInt(12); w++) {
        text.append(words[random.nextInt(words.length)]).append(' ');
      }
      RepairCase c = store.cases().open(unit, text.toString());
      for (int n = 0; n < random.nextInt(4); n++) {
        store
            .cases()
            .addNote(
                c.id(),
                words[random.nextInt(words.length)]
                    + " "
                    + words[random.nextInt(words.length)]
                    + " relay");
      }
      clock.advanceMillis(1);
    }
    for (String word : List.of("relay", "buzz pop", "chatter")) {
      SearchQuery wordsOnly = SearchQuery.all().withText(word).withLimit(7);
      List<SearchHit> fast = store.cases().search(wordsOnly);
      List<SearchHit> full = store.cases().search(wordsOnly.withOpenedFrom(Instant.EPOCH));
      assertThat(fast).as(word).isEqualTo(full);
      assertThat(fast).as(word).isNotEmpty();
    }
  }

  private List<String> ids(SearchQuery query) {
    return store.cases().search(query).stream().map(SearchHit::caseId).toList();
  }
}
