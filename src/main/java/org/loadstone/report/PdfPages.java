package org.loadstone.report;

import java.util.Calendar;
import org.apache.pdfbox.cos.COSDictionary;
import org.apache.pdfbox.pdmodel.PDDocument;
import org.apache.pdfbox.pdmodel.PDDocumentInformation;
import org.apache.pdfbox.pdmodel.interactive.viewerpreferences.PDViewerPreferences;

/** What a report's PDF says about itself: title, author, subject, keywords, producer. */
final class PdfPages {
  private PdfPages() {}

  /** Writes the document information and asks viewers to show the title, not the file name. */
  static void describe(PDDocument doc, PdfLayout.PdfInfo info) {
    PDDocumentInformation d = doc.getDocumentInformation();
    d.setTitle(info.title());
    if (!info.author().isBlank()) {
      d.setAuthor(info.author());
    }
    d.setSubject(info.subject());
    d.setKeywords(info.keywords());
    d.setProducer(info.producer());
    d.setCreator(info.producer());
    d.setCreationDate(Calendar.getInstance());
    PDViewerPreferences prefs = new PDViewerPreferences(new COSDictionary());
    prefs.setDisplayDocTitle(true);
    doc.getDocumentCatalog().setViewerPreferences(prefs);
    doc.getDocumentCatalog().setLanguage("en");
  }
}
