package spanwright.io;

/**
 * Text for LaTeX (pdflatex with its default encodings): what the TikZ figures and the sweep
 * tables write into documents and comments. Cost: O(length). Stateless.
 */
public final class TexText {
    private TexText() {}

    /**
     * {@code s} as TeX text: the ten special characters escaped, the few non-ASCII characters
     * Spanwright's own texts use (√, ∞, −, —, ₊, ₋, ≤, ≥, φ, ·) written as TeX; any other
     * non-ASCII character becomes "?" so that pdflatex never stops on it.
     */
    public static String escape(String s) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '\\': sb.append("\\textbackslash{}"); break;
                case '{': sb.append("\\{"); break;
                case '}': sb.append("\\}"); break;
                case '$': sb.append("\\$"); break;
                case '&': sb.append("\\&"); break;
                case '#': sb.append("\\#"); break;
                case '%': sb.append("\\%"); break;
                case '_': sb.append("\\_"); break;
                case '^': sb.append("\\^{}"); break;
                case '~': sb.append("\\~{}"); break;
                case '<': sb.append("$<$"); break;
                case '>': sb.append("$>$"); break;
                case '|': sb.append("$|$"); break;
                case '√': sb.append("$\\surd$"); break;
                case '∞': sb.append("$\\infty$"); break;
                case '−': sb.append("$-$"); break;
                case '—': sb.append("---"); break;
                case '–': sb.append("--"); break;
                case '₊': sb.append("$_+$"); break;
                case '₋': sb.append("$_-$"); break;
                case '≤': sb.append("$\\le$"); break;
                case '≥': sb.append("$\\ge$"); break;
                case 'φ': sb.append("$\\varphi$"); break;
                case '·': sb.append("$\\cdot$"); break;
                case '…': sb.append("\\dots{}"); break;
                case '×': sb.append("$\\times$"); break;
                case '\n': sb.append(' '); break;
                default:
                    sb.append(c < 128 ? c : '?');
            }
        }
        return sb.toString();
    }
}
