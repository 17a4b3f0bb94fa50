package org.lagmill.report;

import java.io.StringReader;
import java.util.ArrayList;
import java.util.List;
import javax.xml.parsers.DocumentBuilder;
import javax.xml.parsers.DocumentBuilderFactory;
import javax.xml.xpath.XPathConstants;
import javax.xml.xpath.XPathFactory;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.Node;
import org.w3c.dom.NodeList;
import org.xml.sax.InputSource;

/** The report page parsed with the JDK's XML parser, which also proves it well-formed; queries by XPath. */
final class XmlPage {
  private final Document document;

  private XmlPage(Document document) {
    this.document = document;
  }

  static XmlPage parse(String html) throws Exception {
    DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
    f.setNamespaceAware(false);
    f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
    DocumentBuilder builder = f.newDocumentBuilder();
    builder.setErrorHandler(null);
    return new XmlPage(builder.parse(new InputSource(new StringReader(html))));
  }

  List<Element> all(String xpath) throws Exception {
    NodeList nodes = (NodeList) XPathFactory.newInstance().newXPath().evaluate(xpath, document,
        XPathConstants.NODESET);
    List<Element> out = new ArrayList<>();
    for (int i = 0; i < nodes.getLength(); i++) {
      out.add((Element) nodes.item(i));
    }
    return out;
  }

  int count(String xpath) throws Exception {
    return all(xpath).size();
  }

  String text(String xpath) throws Exception {
    List<Element> found = all(xpath);
    if (found.size() != 1) {
      throw new AssertionError("expected one node for " + xpath + ", found " + found.size());
    }
    return found.get(0).getTextContent();
  }

  /** Cell texts of one table row, header cell first. */
  static List<String> cells(Element row) {
    List<String> out = new ArrayList<>();
    for (Node n = row.getFirstChild(); n != null; n = n.getNextSibling()) {
      if (n instanceof Element e && (e.getTagName().equals("td") || e.getTagName().equals("th"))) {
        out.add(e.getTextContent());
      }
    }
    return out;
  }

  /** Whether the row's cell at {@code index} prints in bold. */
  static boolean strong(Element row, int index) {
    int i = 0;
    for (Node n = row.getFirstChild(); n != null; n = n.getNextSibling()) {
      if (n instanceof Element e && (e.getTagName().equals("td") || e.getTagName().equals("th"))) {
        if (i++ == index) {
          return e.getElementsByTagName("strong").getLength() == 1;
        }
      }
    }
    throw new AssertionError("row has no cell " + index);
  }
}
