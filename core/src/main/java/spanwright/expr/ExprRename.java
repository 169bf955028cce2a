package spanwright.expr;

/**
 * Renames a variable inside expression text, token by token, keeping the user's spacing and
 * parentheses: every name token equal to {@code from} that is not a function call (not followed by
 * "(") becomes {@code to}. Names are as in {@link ExprParser}: a letter or _, then letters,
 * digits, _ or ".". O(length).
 */
public final class ExprRename {
    private ExprRename() {}

    public static String rename(String text, String from, String to) {
        if (text == null) {
            return null;
        }
        StringBuilder sb = new StringBuilder(text.length() + 8);
        int i = 0;
        int n = text.length();
        while (i < n) {
            char c = text.charAt(i);
            if (Character.isLetter(c) || c == '_') {
                int start = i;
                while (i < n && (Character.isLetterOrDigit(text.charAt(i)) || text.charAt(i) == '_'
                        || text.charAt(i) == '.')) {
                    i++;
                }
                String name = text.substring(start, i);
                int j = i;
                while (j < n && Character.isWhitespace(text.charAt(j))) {
                    j++;
                }
                boolean call = j < n && text.charAt(j) == '(';
                sb.append(!call && name.equals(from) ? to : name);
            } else if (Character.isDigit(c)) {
                // a number (k of thr/exactly/atmost, or a constant) — copied with any trailing name chars
                int start = i;
                while (i < n && (Character.isLetterOrDigit(text.charAt(i)) || text.charAt(i) == '_'
                        || text.charAt(i) == '.')) {
                    i++;
                }
                sb.append(text, start, i);
            } else {
                sb.append(c);
                i++;
            }
        }
        return sb.toString();
    }
}
