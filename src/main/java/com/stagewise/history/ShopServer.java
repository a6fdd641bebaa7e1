package com.stagewise.history;

import com.stagewise.history.record.HistoryBundle;
import java.util.Map;

/**
 * What a bench asks of the shop server when it syncs (the server store implements it).
 *
 * <p>Every record on the server carries a change number, drawn from one sequence whenever it is
 * added or changed; numbers become visible in order, so a bench that has merged everything up to
 * number n only ever needs what lies above n.
 */
public interface ShopServer extends AutoCloseable {

  /** Returns where the server is, for messages. */
  ServerAddress address();

  /**
   * Merges a bundle into the server's history in one transaction, by the bundle rules ({@link
   * Transfer#importBundle}).
   */
  ImportReport upload(HistoryBundle bundle, String source);

  /**
   * Returns, in one consistent read, every record whose change number is above {@code after}
   * (together with the board model, unit and case each of them belongs to, so that the bundle
   * stands on its own), and the highest change number it covers.
   */
  Changes changesSince(long after, String programVersion);

  /**
   * Returns the shop's confirmed-fault counts of every board model (by the model's name): for each,
   * how many closed cases with outcome fixed confirmed each fault id.
   */
  Map<String, Map<String, Integer>> confirmedFaultCounts();

  @Override
  void close();

  /**
   * Records changed on the server since a change number.
   *
   * @param bundle the records, parents first
   * @param through the highest change number the bundle covers (the next call starts above it)
   */
  record Changes(HistoryBundle bundle, long through) {}
}
